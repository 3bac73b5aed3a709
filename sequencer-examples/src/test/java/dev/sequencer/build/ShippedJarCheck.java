package dev.sequencer.build;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.jar.JarFile;
import java.util.zip.ZipEntry;
import org.junit.jupiter.api.Test;

/**
 * The command-line jar as built (runs in {@code mvn verify}, after packaging): the OR-Tools natives of
 * the platform it was built for and no other, at most 60 MB for one platform, our licence and notice,
 * the third-party licence list without GPL, no JFreeSVG, the main class and module name in the manifest.
 */
class ShippedJarCheck {
  /** Every platform OR-Tools 9.x ships natives for (the folder names in its jars, without "ortools-"). */
  static final List<String> PLATFORMS =
      List.of("linux-x86-64", "linux-aarch64", "darwin-x86-64", "darwin-aarch64", "win32-x86-64");
  /** The limit for a one-platform jar. */
  private static final long MAX_ONE_PLATFORM_BYTES = 60_000_000L;

  static Path target() {
    String t = System.getProperty("sequencer.build.target");
    assumeTrue(t != null, "sequencer.build.target is not set: run this check through mvn verify");
    return Path.of(t);
  }

  private static String platforms() {
    return System.getProperty("sequencer.build.jarPlatforms");
  }

  @Test
  void sequencerJarHoldsTheNativesOfItsPlatformOnly() throws IOException {
    Path jar = target().resolve("sequencer.jar");
    if ("all".equals(platforms())) {
      assertEquals(new TreeSet<>(PLATFORMS), nativeFolders(jar));
      for (String p : PLATFORMS) {
        Path one = target().resolve("sequencer-" + p + ".jar");
        assertEquals(Set.of(p), nativeFolders(one), one.toString());
        assertTrue(Files.size(one) <= MAX_ONE_PLATFORM_BYTES, one + ": " + Files.size(one) + " bytes");
        assertShippable(one);
      }
    } else {
      assertTrue(PLATFORMS.contains(platforms()), "built for " + platforms());
      assertEquals(Set.of(platforms()), nativeFolders(jar));
      assertTrue(Files.size(jar) <= MAX_ONE_PLATFORM_BYTES, jar + ": " + Files.size(jar) + " bytes");
    }
    assertShippable(jar);
  }

  /** The platform folders ("linux-x86-64", ...) of the OR-Tools natives in {@code jar}. */
  static Set<String> nativeFolders(Path jar) throws IOException {
    Set<String> out = new TreeSet<>();
    try (JarFile j = new JarFile(jar.toFile())) {
      j.stream().map(ZipEntry::getName).filter(n -> n.startsWith("ortools-") && n.indexOf('/') > 0)
          .forEach(n -> out.add(n.substring("ortools-".length(), n.indexOf('/'))));
    }
    return out;
  }

  /** Licence files present and right, no GPL library listed, no JFreeSVG classes. */
  private static void assertShippable(Path jar) throws IOException {
    try (JarFile j = new JarFile(jar.toFile())) {
      assertArrayEquals(Files.readAllBytes(MavenChild.root().resolve("LICENSE")), bytes(j, "META-INF/LICENSE"),
          jar + ": META-INF/LICENSE is not the project's LICENSE");
      assertTrue(new String(bytes(j, "META-INF/NOTICE"), StandardCharsets.UTF_8).contains("The sequencer developers"));
      String thirdParty = new String(bytes(j, "THIRD-PARTY.txt"), StandardCharsets.UTF_8);
      assertTrue(thirdParty.contains("(Apache-2.0) OREKIT"), thirdParty);
      assertFalse(thirdParty.matches("(?s).*\\((A?GPL)[-)].*"), thirdParty);
      assertTrue(j.stream().noneMatch(e -> e.getName().startsWith("org/jfree/svg/")), jar + " holds JFreeSVG");
      var main = j.getManifest().getMainAttributes();
      assertEquals("dev.sequencer.cli.SequencerCli", main.getValue("Main-Class"));
      assertEquals("dev.sequencer.examples", main.getValue("Automatic-Module-Name"));
    }
  }

  static byte[] bytes(JarFile j, String entry) throws IOException {
    ZipEntry e = j.getEntry(entry);
    assertTrue(e != null, entry + " missing");
    return j.getInputStream(e).readAllBytes();
  }
}
