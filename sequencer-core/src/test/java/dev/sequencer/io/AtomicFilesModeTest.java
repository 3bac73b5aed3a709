package dev.sequencer.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Files written by {@link AtomicFiles} get the mode a plain write gives: POSIX open(2) with mode 0666,
 * less the umask (IEEE Std 1003.1, open() and umask()), so 0644 under umask 022 and 0640 under 027; a
 * replaced file keeps its mode. The umask belongs to the process, so each case runs a child JVM started
 * by {@code sh -c 'umask U; exec java ...'}; the expected modes are this arithmetic, not read back from
 * our code.
 */
class AtomicFilesModeTest {
  /** Child JVM: writes args[0] (a new file) and args[1] (an existing one) with {@link AtomicFiles}. */
  public static void main(String[] args) {
    AtomicFiles.writeUtf8(Path.of(args[0]), "new\n");
    AtomicFiles.writeBytes(Path.of(args[1]), "replaced\n".getBytes(StandardCharsets.UTF_8));
  }

  @ParameterizedTest(name = "umask {0}")
  @CsvSource({"022, rw-r--r--", "027, rw-r-----", "077, rw-------"})
  void newFilesGetTheDefaultModeAndReplacedFilesKeepTheirs(String umask, String expectedNew, @TempDir Path dir)
      throws Exception {
    assumeTrue(Files.getFileStore(dir).supportsFileAttributeView("posix"), "no POSIX permissions on this file system");
    Path fresh = dir.resolve("fresh.json");
    Path existing = dir.resolve("existing.csv");
    Files.writeString(existing, "old\n");
    Files.setPosixFilePermissions(existing, PosixFilePermissions.fromString("rw----r--"));

    String out = runChild(umask, fresh, existing);

    assertEquals(expectedNew, PosixFilePermissions.toString(Files.getPosixFilePermissions(fresh)), out);
    assertEquals("rw----r--", PosixFilePermissions.toString(Files.getPosixFilePermissions(existing)), out);
    assertEquals("new\n", Files.readString(fresh));
    assertEquals("replaced\n", Files.readString(existing));
    try (Stream<Path> files = Files.list(dir)) {
      assertEquals(List.of("existing.csv", "fresh.json"), files.map(p -> p.getFileName().toString()).sorted().toList(),
          "no temporary file left behind");
    }
  }

  private static String runChild(String umask, Path fresh, Path existing) throws IOException, InterruptedException {
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    String script = "umask " + umask + " && exec \"$0\" -cp \"$1\" " + AtomicFilesModeTest.class.getName()
        + " \"$2\" \"$3\"";
    Process p = new ProcessBuilder("sh", "-c", script, java, System.getProperty("java.class.path"),
        fresh.toString(), existing.toString()).redirectErrorStream(true).start();
    String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    if (!p.waitFor(60, TimeUnit.SECONDS)) {
      p.destroyForcibly();
    }
    assertEquals(0, p.exitValue(), out);
    return out;
  }
}
