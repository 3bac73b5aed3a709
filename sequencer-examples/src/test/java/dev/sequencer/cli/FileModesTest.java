package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Every file the command line writes (JSON, CSV, PNG, SVG) gets 0666 less the umask, as a plain write
 * would (POSIX open() and umask()): readable by the group and others under the usual umask 022, by the
 * group only under 027. The umask belongs to the process: the demo runs in a child JVM started under it.
 */
class FileModesTest {
  @ParameterizedTest(name = "umask {0}")
  @CsvSource({"022, rw-r--r--", "027, rw-r-----"})
  void demoOutputsGetTheDefaultMode(String umask, String expected, @TempDir Path dir) throws Exception {
    assumeTrue(Files.getFileStore(dir).supportsFileAttributeView("posix"), "no POSIX permissions on this file system");
    Path out = dir.resolve("demo-out");
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    Process p = new ProcessBuilder("sh", "-c", "umask " + umask + " && exec \"$0\" -cp \"$1\" "
        + SequencerCli.class.getName() + " demo --solver greedy -o \"$2\"", java,
        System.getProperty("java.class.path"), out.toString()).redirectErrorStream(true).start();
    String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    if (!p.waitFor(120, TimeUnit.SECONDS)) {
      p.destroyForcibly();
    }
    assertEquals(0, p.exitValue(), log);

    Map<String, String> modes = new TreeMap<>();
    try (Stream<Path> files = Files.list(out)) {
      for (Path f : files.toList()) {
        modes.put(f.getFileName().toString(), PosixFilePermissions.toString(Files.getPosixFilePermissions(f)));
      }
    }
    assertEquals(List.of("demo-sky.png", "demo-sky.svg", "demo-timeline.png", "demo-timeline.svg", "night.html", "plan.csv",
        "timeline.json", "windows.json"), List.copyOf(modes.keySet()), log);
    modes.forEach((name, mode) -> assertEquals(expected, mode, name));
  }
}
