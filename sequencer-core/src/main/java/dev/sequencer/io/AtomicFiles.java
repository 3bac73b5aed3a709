package dev.sequencer.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Whole-file writes that never leave a half-written target: the text goes to a temporary file in the
 * same directory, is forced to disk, then moved over the target atomically (or, where the file system
 * cannot, with a plain replacing move).
 */
public final class AtomicFiles {
  private AtomicFiles() {}

  /** Writes {@code text} as UTF-8 to {@code target} atomically; an I/O failure is an {@link UncheckedIOException}. */
  public static void writeUtf8(Path target, String text) {
    writeBytes(target, text.getBytes(StandardCharsets.UTF_8));
  }

  /** Writes {@code bytes} to {@code target} atomically; an I/O failure is an {@link UncheckedIOException}. */
  public static void writeBytes(Path target, byte[] bytes) {
    Path absolute = target.toAbsolutePath();
    Path dir = absolute.getParent();
    Path tmp = null;
    try {
      tmp = Files.createTempFile(dir, "." + absolute.getFileName() + ".", ".tmp");
      try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING)) {
        ByteBuffer buf = ByteBuffer.wrap(bytes);
        while (buf.hasRemaining()) {
          ch.write(buf);
        }
        ch.force(true);
      }
      try {
        Files.move(tmp, absolute, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(tmp, absolute, StandardCopyOption.REPLACE_EXISTING);
      }
      tmp = null;
    } catch (IOException e) {
      throw new UncheckedIOException("cannot write " + target, e);
    } finally {
      if (tmp != null) {
        try {
          Files.deleteIfExists(tmp);
        } catch (IOException ignored) {
          // the write already failed; that error is the one to report
        }
      }
    }
  }
}
