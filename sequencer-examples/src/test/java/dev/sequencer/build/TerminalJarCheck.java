package dev.sequencer.build;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The built jar's progress output under each JDK installed here (this build's, and every JDK 22 or
 * later under /usr/lib/jvm): with standard output redirected to a file, plain lines and no carriage
 * return; on a terminal (a pseudo-terminal made by util-linux {@code script}), the status line redrawn
 * in place. On JDK 22 to 24 {@code System.console()} is not null even when output is redirected, which
 * is why the jar asks {@code Console.isTerminal()}; JDK 25 returns null there again, so on the JDKs
 * found here that case itself cannot occur and is covered by {@code ProgressTest} only.
 */
class TerminalJarCheck {
  private static final String SCENARIO = "src/main/resources/scenarios/demo-night.json";

  /** This build's JDK and each JDK 22+ under /usr/lib/jvm (by the JAVA_VERSION of its release file). */
  static List<Path> javas() throws IOException {
    List<Path> out = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java")));
    Path jvms = Path.of("/usr/lib/jvm");
    if (Files.isDirectory(jvms)) {
      try (Stream<Path> dirs = Files.list(jvms)) {
        for (Path d : dirs.sorted().toList()) {
          Path release = d.resolve("release");
          Path java = d.resolve("bin/java");
          if (Files.isRegularFile(release) && Files.isExecutable(java) && major(release) >= 22) {
            out.add(java);
          }
        }
      }
    }
    return out;
  }

  private static int major(Path release) throws IOException {
    for (String line : Files.readAllLines(release)) {
      if (line.startsWith("JAVA_VERSION=")) {
        String v = line.substring("JAVA_VERSION=".length()).replace("\"", "");
        return Integer.parseInt(v.split("[.+-]")[0]);
      }
    }
    return 0;
  }

  private static Path jar() {
    Path jar = ShippedJarCheck.target().resolve("sequencer.jar");
    assumeTrue(Files.isRegularFile(jar), "no sequencer.jar: run mvn verify");
    return jar;
  }

  private static final java.util.regex.Pattern PLAIN_PROGRESS = java.util.regex.Pattern.compile("plan \\d+: priority");

  private static List<String> plan(Path java) {
    return List.of(java.toString(), "-jar", jar().toString(), "plan", SCENARIO, "--time-limit", "3", "--workers", "1");
  }

  @Test
  void redirectedOutputHasNoRedraws(@TempDir Path dir) throws Exception {
    for (Path java : javas()) {
      Path out = dir.resolve("out.txt");
      Process p = new ProcessBuilder(plan(java)).redirectOutput(out.toFile()).redirectErrorStream(false)
          .redirectError(dir.resolve("err.txt").toFile()).start();
      assertTrue(p.waitFor(180, TimeUnit.SECONDS), java + " did not finish");
      String text = Files.readString(out, StandardCharsets.UTF_8);
      assertEquals(0, p.exitValue(), java + "\n" + text + Files.readString(dir.resolve("err.txt")));
      assertTrue(PLAIN_PROGRESS.matcher(text).find(), java + ": no plain progress line\n" + text);
      assertFalse(text.contains("\r"), java + ": carriage return in redirected output\n" + text);
    }
  }

  @Test
  void aTerminalGetsTheLineRedrawnInPlace(@TempDir Path dir) throws Exception {
    assumeTrue(System.getProperty("os.name").equals("Linux") && Files.isExecutable(Path.of("/usr/bin/script")),
        "needs util-linux script for a pseudo-terminal");
    for (Path java : javas()) {
      String command = String.join(" ", plan(java).stream().map(a -> "'" + a + "'").toList());
      Process p = new ProcessBuilder("/usr/bin/script", "-qec", command, "/dev/null")
          .redirectErrorStream(true).redirectInput(ProcessBuilder.Redirect.PIPE).start();
      p.getOutputStream().close();
      String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
      assertTrue(p.waitFor(180, TimeUnit.SECONDS), java + " did not finish");
      assertEquals(0, p.exitValue(), java + "\n" + text);
      // The terminal turns each "\n" into "\r\n"; a redraw is a carriage return before the status line.
      assertTrue(text.contains("\r  planning "), java + ": no in-place status line\n" + text);
    }
  }
}
