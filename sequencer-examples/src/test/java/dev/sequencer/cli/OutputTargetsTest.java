package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every output target (-o, --csv, --plot, demo's -o DIR) is checked before any work: a target that
 * cannot be written is exit 2 naming the option, the path and the true reason, and nothing runs (no
 * windows line, no solver summary, no file written).
 */
class OutputTargetsTest {
  private static final Path DEMO = Path.of("src/main/resources/scenarios/demo-night.json");

  /**
   * A folder this user cannot create files in: a read-only (0555) folder, or, when the user may write
   * there anyway (root), /proc/self (Linux: the kernel refuses new files whoever asks). The folder is
   * probed here with the same create-new open the program uses.
   */
  private static Path unwritableFolder(Path tmp) throws IOException {
    Path ro = tmp.resolve("read-only");
    Files.createDirectory(ro);
    if (Files.getFileStore(ro).supportsFileAttributeView("posix")) {
      Files.setPosixFilePermissions(ro, PosixFilePermissions.fromString("r-xr-xr-x"));
      if (!canCreateIn(ro)) {
        return ro;
      }
    }
    Path proc = Path.of("/proc/self");
    assumeTrue(Files.isDirectory(proc) && !canCreateIn(proc), "no folder this user cannot write to");
    return proc;
  }

  private static boolean canCreateIn(Path dir) {
    Path probe = dir.resolve("probe-" + System.nanoTime());
    try {
      FileChannel.open(probe, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE).close();
      Files.delete(probe);
      return true;
    } catch (IOException e) {
      return false;
    }
  }

  private static void assertNothingRan(Runs.Run r) {
    Runs.assertNoStackTrace(r);
    assertEquals(2, r.code(), r::all);
    assertFalse(r.out().contains("status "), () -> "the solver ran\n" + r.all());
    assertFalse(r.out().contains("windows:"), () -> "the windows were computed\n" + r.all());
    assertFalse(r.out().contains("wrote "), () -> "something was written\n" + r.all());
  }

  @Test
  void anUnwritablePlotFolderIsRejectedBeforeTheRun(@TempDir Path tmp) throws IOException {
    Path folder = unwritableFolder(tmp);
    Path out = tmp.resolve("t.json");
    Runs.Run r = Runs.run("plan", DEMO.toString(), "--time-limit", "30", "-o", out.toString(),
        "--plot", folder.resolve("night").toString());
    assertNothingRan(r);
    String first = folder.resolve("night-timeline.png").toString();
    assertTrue(r.err().startsWith("--plot: cannot write " + first + ": "), r::all);
    assertTrue(r.err().contains("permission denied") || r.err().contains("does not accept new files"), r::all);
    assertFalse(Files.exists(out), "-o was written although --plot cannot be");
  }

  @Test
  void anUnwritableCsvFolderIsRejectedBeforeTheRun(@TempDir Path tmp) throws IOException {
    Path folder = unwritableFolder(tmp);
    Runs.Run r = Runs.run("plan", DEMO.toString(), "--csv", folder.resolve("plan.csv").toString());
    assertNothingRan(r);
    assertTrue(r.err().startsWith("--csv: cannot write " + folder.resolve("plan.csv") + ": "), r::all);
  }

  @Test
  void aFileUnderProcGetsItsTrueCause() {
    Path proc = Path.of("/proc");
    assumeTrue(Files.isDirectory(proc) && !canCreateIn(proc), "Linux /proc only");
    for (String cmd : new String[] {"plan", "windows"}) {
      Runs.Run r = Runs.run(cmd, DEMO.toString(), "-o", "/proc/x.json");
      assertNothingRan(r);
      // Was "the folder does not exist", after the whole run.
      assertEquals("--output: cannot write /proc/x.json: the folder /proc does not accept new files "
          + "(file system: proc)", r.err().strip(), r::all);
    }
  }

  @Test
  void aFolderThatIsAFileIsNamed(@TempDir Path tmp) throws IOException {
    Path file = Files.writeString(tmp.resolve("not-a-folder"), "x");
    Runs.Run r = Runs.run("plan", DEMO.toString(), "--csv", file.resolve("plan.csv").toString());
    assertNothingRan(r);
    assertTrue(r.err().contains("--csv: cannot write " + file.resolve("plan.csv") + ": " + file
        + " is a file, not a folder"), r::all);
  }

  @Test
  void aTargetThatIsAFolderIsNamed(@TempDir Path tmp) {
    Runs.Run r = Runs.run("windows", DEMO.toString(), "-o", tmp.toString());
    assertNothingRan(r);
    assertTrue(r.err().contains("--output: cannot write " + tmp + ": it is a folder"), r::all);
  }

  @Test
  void twoOptionsNamingOneFileAreRejected(@TempDir Path tmp) {
    Path f = tmp.resolve("same.json");
    Runs.Run r = Runs.run("plan", DEMO.toString(), "-o", f.toString(), "--csv", f.toString());
    assertNothingRan(r);
    assertTrue(r.err().contains("--csv: cannot write " + f + ": --output writes the same file"), r::all);
  }

  @Test
  void demoChecksItsFolderFirst(@TempDir Path tmp) throws IOException {
    Path file = Files.writeString(tmp.resolve("plain-file"), "x");
    Runs.Run r = Runs.run("demo", "-o", file.resolve("out").toString());
    assertNothingRan(r);
    assertTrue(r.err().startsWith("--output-dir: cannot write into " + file.resolve("out") + ": "), r::all);
    assertTrue(r.out().isEmpty(), r::all);

    Path folder = unwritableFolder(tmp);
    Runs.Run r2 = Runs.run("demo", "-o", folder.toString());
    assertNothingRan(r2);
    assertTrue(r2.err().startsWith("--output-dir: cannot write into " + folder + ": "), r2::all);
    try (Stream<Path> s = Files.list(tmp)) {
      assertTrue(s.noneMatch(p -> p.getFileName().toString().startsWith(".sequencer-write-check")), "probe left behind");
    }
  }
}
