package dev.sequencer.cli;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.ThreadLocalRandom;

/**
 * The places a command will write, checked before any work so that a bad {@code -o}, {@code --csv} or
 * {@code --plot} fails in seconds with the true cause, not after a solve. A folder is checked by creating
 * (and deleting) a small probe file in it, the same operation the atomic write makes, so the answer holds
 * for the current user, file system and mount (a read-only mount, {@code /proc}, a folder without write
 * permission). Problems are {@link InputException}s (exit 2) naming the option, the path and the reason.
 */
final class Outputs {
  private Outputs() {}

  /** The files one option will write (empty when the option was not given). */
  record Target(String option, List<Path> files, boolean createFolder) {
    Target {
      Objects.requireNonNull(option, "option");
      files = List.copyOf(files);
    }
  }

  /** {@code option} writes {@code file}; {@code file} may be null (option not given). */
  static Target file(String option, Path file) {
    return new Target(option, file == null ? List.of() : List.of(file), false);
  }

  /**
   * {@code --plot PREFIX} writes PREFIX-timeline.png/.svg and PREFIX-sky.png/.svg, with several resources a sky
   * chart per resource ({@link PlanOutputs#plotSuffixes}); {@code prefix} may be null.
   */
  static Target plot(String option, String prefix, dev.sequencer.model.Scenario s) {
    if (prefix == null) {
      return new Target(option, List.of(), false);
    }
    List<Path> files = new ArrayList<>();
    for (String suffix : PlanOutputs.plotSuffixes(s)) {
      files.add(Path.of(prefix + suffix));
    }
    return new Target(option, files, false);
  }

  /** {@code option} writes files into {@code dir}, which is created when missing. */
  static Target folder(String option, Path dir) {
    return new Target(option, List.of(dir), true);
  }

  /**
   * Throws an {@link InputException} for the first target that cannot be written, or when two options
   * name the same file; creates the folders of {@link #folder} targets.
   */
  static void check(Target... targets) {
    Map<Path, String> seen = new HashMap<>();
    for (Target t : targets) {
      for (Path f : t.files()) {
        Path abs = f.toAbsolutePath().normalize();
        String other = seen.putIfAbsent(abs, t.option());
        if (other != null && !t.createFolder()) {
          throw new InputException(t.option() + ": cannot write " + f + ": " + other + " writes the same file");
        }
        if (t.createFolder()) {
          checkFolder(t.option(), abs, true);
        } else {
          checkFile(t.option(), f, abs);
        }
      }
    }
  }

  private static void checkFile(String option, Path file, Path abs) {
    if (Files.isDirectory(abs)) {
      throw new InputException(option + ": cannot write " + file + ": it is a folder");
    }
    Path dir = abs.getParent();
    if (dir == null) {
      throw new InputException(option + ": cannot write " + file + ": not a file name");
    }
    String why = folderProblem(dir, false);
    if (why != null) {
      throw new InputException(option + ": cannot write " + file + ": " + why);
    }
  }

  private static void checkFolder(String option, Path dir, boolean create) {
    String why = folderProblem(dir, create);
    if (why != null) {
      throw new InputException(option + ": cannot write into " + dir + ": " + why);
    }
  }

  /** Why no new file can be made in {@code dir} (created first when {@code create}), or null when one can. */
  private static String folderProblem(Path dir, boolean create) {
    if (!Files.exists(dir)) {
      Path existing = dir;
      while (existing != null && !Files.exists(existing)) {
        existing = existing.getParent();
      }
      if (existing != null && !Files.isDirectory(existing)) {
        return existing + " is a file, not a folder";
      }
      if (!create) {
        return "the folder " + dir + " does not exist";
      }
      try {
        Files.createDirectories(dir);
      } catch (IOException e) {
        return "cannot create the folder " + dir + ": " + reason(e, existing);
      }
    }
    if (!Files.isDirectory(dir)) {
      return dir + " is a file, not a folder";
    }
    Path probe = dir.resolve(".sequencer-write-check-" + Long.toHexString(ThreadLocalRandom.current().nextLong()));
    try {
      FileChannel.open(probe, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE).close();
    } catch (IOException e) {
      return reason(e, dir);
    }
    try {
      Files.deleteIfExists(probe);
    } catch (IOException e) {
      return "a file made in " + dir + " cannot be removed again: " + reason(e, dir);
    }
    return null;
  }

  /** A short, true reason for a failed write into {@code dir}: the kind of failure, never a Java class name. */
  static String reason(IOException e, Path dir) {
    if (e instanceof AccessDeniedException) {
      return "permission denied (this user may not create files in " + dir + ")";
    }
    if (e instanceof NotDirectoryException) {
      return dir + " is a file, not a folder";
    }
    if (e instanceof NoSuchFileException) {
      if (dir != null && Files.isDirectory(dir)) {
        // The folder is there but refuses new entries: /proc, /sys and similar virtual file systems.
        return "the folder " + dir + " does not accept new files" + fileSystem(dir);
      }
      return "the folder " + dir + " does not exist";
    }
    String r = e instanceof FileSystemException fse && fse.getReason() != null ? fse.getReason() : e.getMessage();
    return r == null ? "input/output error" : r.substring(0, 1).toLowerCase(java.util.Locale.ROOT) + r.substring(1)
        + fileSystem(dir);
  }

  /** " (file system: proc)", or "" when the type is not known. */
  private static String fileSystem(Path dir) {
    try {
      String type = dir == null ? "" : Files.getFileStore(dir).type();
      return type.isEmpty() ? "" : " (file system: " + type + ")";
    } catch (IOException e) {
      return "";
    }
  }

  /** A short reason for a write that failed during the work, after the checks above had passed. */
  static String why(Throwable cause) {
    if (cause instanceof IOException io) {
      Path dir = cause instanceof FileSystemException fse && fse.getFile() != null
          ? Path.of(fse.getFile()).toAbsolutePath().getParent() : null;
      return reason(io, dir);
    }
    return String.valueOf(cause);
  }
}
