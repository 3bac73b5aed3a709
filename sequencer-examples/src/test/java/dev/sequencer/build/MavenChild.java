package dev.sequencer.build;

import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * Runs a throwaway Maven project with the Maven that runs this build (offline, same local repository),
 * for tests of the build's own checks. The build passes its Maven home, local repository and the
 * project root as system properties (see sequencer-examples/pom.xml); run outside Maven, tests that need
 * it are skipped with a message saying so.
 */
final class MavenChild {
  /** One finished Maven run: exit code and everything it printed. */
  record Result(int code, String output) {}

  private MavenChild() {}

  /** The project root (the folder of the parent POM). */
  static Path root() {
    return Path.of(property("sequencer.build.root")).toAbsolutePath().normalize();
  }

  /** Runs {@code mvn -B -o ARGS} in {@code dir}; at most 5 minutes. */
  static Result run(Path dir, String... args) throws IOException, InterruptedException {
    Path mvn = Path.of(property("sequencer.build.mavenHome"), "bin",
        System.getProperty("os.name").startsWith("Windows") ? "mvn.cmd" : "mvn");
    List<String> cmd = new ArrayList<>(List.of(mvn.toString(), "-B", "-o",
        "-Dmaven.repo.local=" + property("sequencer.build.localRepository")));
    cmd.addAll(List.of(args));
    Path log = dir.resolve("maven.log");
    Process p = new ProcessBuilder(cmd).directory(dir.toFile()).redirectErrorStream(true)
        .redirectOutput(log.toFile()).start();
    if (!p.waitFor(5, TimeUnit.MINUTES)) {
      p.destroyForcibly();
      throw new IllegalStateException("the child Maven run took more than 5 minutes: " + cmd);
    }
    return new Result(p.exitValue(), Files.readString(log, StandardCharsets.UTF_8));
  }

  private static String property(String name) {
    String v = System.getProperty(name);
    assumeTrue(v != null && !v.isBlank() && !v.contains("${"), name + " is not set: run this test through Maven");
    return v;
  }
}
