package dev.sequencer.cli;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/** Checks on output files, made before the work so that a bad {@code -o} fails in seconds, not after a solve. */
final class Outputs {
  private Outputs() {}

  /** Throws an {@link InputException} when {@code file}'s folder does not exist ({@code file} may be null). */
  static void checkFolder(String option, Path file) {
    if (file == null) {
      return;
    }
    Path dir = file.toAbsolutePath().getParent();
    if (dir != null && !Files.isDirectory(dir)) {
      throw new InputException(option + ": cannot write " + file + ": the folder " + dir + " does not exist");
    }
    if (Files.isDirectory(file)) {
      throw new InputException(option + ": cannot write " + file + ": it is a folder");
    }
  }

  /** A short reason for a failed write. */
  static String why(Throwable cause) {
    if (cause instanceof NoSuchFileException) {
      return "the folder does not exist";
    }
    if (cause instanceof AccessDeniedException) {
      return "permission denied";
    }
    return cause instanceof IOException && cause.getMessage() != null ? cause.getMessage() : String.valueOf(cause);
  }
}
