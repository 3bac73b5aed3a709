package dev.sequencer.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.util.concurrent.ThreadLocalRandom;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Whole-file writes that never leave a half-written target: the text goes to a temporary file in the
 * same directory, is forced to disk, then moved over the target atomically (or, where the file system
 * cannot, with a plain replacing move).
 *
 * <p>The file ends up with the permissions a plain write would give it: a new file gets the default
 * mode, 0666 less the process umask (0644 under umask 022, 0640 under 027), because the temporary file
 * is created without explicit permissions; a file that is replaced keeps its permission bits (owner and
 * group are those of the writing process, as for any newly created file).
 */
public final class AtomicFiles {
  private static final Logger LOG = LoggerFactory.getLogger(AtomicFiles.class);
  /** Attempts at a fresh temporary name before giving up (each collision is a 1 in 2^64 event). */
  private static final int TEMP_ATTEMPTS = 16;

  private AtomicFiles() {}

  /** Writes {@code text} as UTF-8 to {@code target} atomically; an I/O failure is an {@link UncheckedIOException}. */
  public static void writeUtf8(Path target, String text) {
    writeBytes(target, text.getBytes(StandardCharsets.UTF_8));
  }

  /** Writes {@code bytes} to {@code target} atomically; an I/O failure is an {@link UncheckedIOException}. */
  public static void writeBytes(Path target, byte[] bytes) {
    long t0 = System.nanoTime();
    Path absolute = target.toAbsolutePath();
    Path dir = absolute.getParent();
    Path tmp = null;
    try {
      tmp = write(dir, absolute.getFileName().toString(), bytes);
      keepPermissions(absolute, tmp);
      try {
        Files.move(tmp, absolute, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(tmp, absolute, StandardCopyOption.REPLACE_EXISTING);
      }
      tmp = null;
      LOG.debug("wrote {} ({} bytes) in {} ms", target, bytes.length, (System.nanoTime() - t0) / 1_000_000);
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

  /**
   * Creates {@code .NAME.RANDOM.tmp} in {@code dir} (exclusively, with the default mode), writes and
   * forces {@code bytes} into it; returns its path.
   */
  private static Path write(Path dir, String name, byte[] bytes) throws IOException {
    for (int attempt = 1; ; attempt++) {
      Path tmp = dir.resolve("." + name + "." + Long.toHexString(ThreadLocalRandom.current().nextLong()) + ".tmp");
      FileChannel ch;
      try {
        // No FileAttribute: the file system applies the umask to 0666, exactly as for a plain write.
        ch = FileChannel.open(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
      } catch (FileAlreadyExistsException e) {
        if (attempt == TEMP_ATTEMPTS) {
          throw e;
        }
        continue;
      }
      try (ch) {
        ByteBuffer buf = ByteBuffer.wrap(bytes);
        while (buf.hasRemaining()) {
          ch.write(buf);
        }
        ch.force(true);
      } catch (IOException | RuntimeException e) {
        Files.deleteIfExists(tmp);
        throw e;
      }
      return tmp;
    }
  }

  /** Gives {@code tmp} the permission bits of {@code target} when it exists on a POSIX file system. */
  private static void keepPermissions(Path target, Path tmp) throws IOException {
    PosixFileAttributeView view = Files.getFileAttributeView(target, PosixFileAttributeView.class,
        LinkOption.NOFOLLOW_LINKS);
    if (view != null && Files.isRegularFile(target, LinkOption.NOFOLLOW_LINKS)) {
      Files.setPosixFilePermissions(tmp, view.readAttributes().permissions());
    }
  }
}
