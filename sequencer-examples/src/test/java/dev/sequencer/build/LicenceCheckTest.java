package dev.sequencer.build;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The build's licence check (license-maven-plugin, configured once in the parent POM) fails a module
 * that ships a GPL dependency or one under a licence not on the list, and passes one whose dependencies
 * are all permissive. Both modules inherit
 * the real parent POM; the dependencies are planted in the same throwaway reactor, so nothing is
 * downloaded or installed.
 */
class LicenceCheckTest {
  @Test
  void aPlantedGplOrUnlistedDependencyFailsTheBuildAndAPermissiveOnePasses(@TempDir Path dir) throws Exception {
    Files.writeString(dir.resolve("pom.xml"), """
        <project xmlns="http://maven.apache.org/POM/4.0.0">
          <modelVersion>4.0.0</modelVersion>
          <groupId>test.planted</groupId><artifactId>reactor</artifactId><version>1</version>
          <packaging>pom</packaging>
          <modules><module>gpl-library</module><module>apache-library</module><module>unlisted-library</module>
            <module>ships-gpl</module><module>ships-apache</module><module>ships-unlisted</module></modules>
        </project>
        """);
    library(dir, "gpl-library", "GNU General Public License, version 3", "https://www.gnu.org/licenses/gpl-3.0.txt");
    library(dir, "apache-library", "Apache License, Version 2.0", "https://www.apache.org/licenses/LICENSE-2.0.txt");
    library(dir, "unlisted-library", "Example Licence 1.0 (invented)", "https://example.org/licence");
    shipping(dir, "ships-gpl", "gpl-library");
    shipping(dir, "ships-apache", "apache-library");
    shipping(dir, "ships-unlisted", "unlisted-library");

    MavenChild.Result r = MavenChild.run(dir, "--fail-at-end", "generate-resources");

    assertNotEquals(0, r.code(), r.output());
    // Reactor summary lines: "[INFO] ships-gpl 0.1.0-SNAPSHOT .... FAILURE [  2.5 s]".
    assertTrue(summary("ships-gpl", "FAILURE").matcher(r.output()).find(), r.output());
    assertTrue(summary("ships-unlisted", "FAILURE").matcher(r.output()).find(), r.output());
    assertTrue(summary("ships-apache", "SUCCESS").matcher(r.output()).find(), r.output());
    // The plugin's own words: the GPL one is named as forbidden, with the dependency that brings it.
    assertTrue(Pattern.compile("License: 'GPL' used by 1 dependencies:\\s+-gpl-library \\(test\\.planted:gpl-library:1")
        .matcher(r.output()).find(), r.output());
    // The permissive module's report lists its dependency under the merged SPDX name.
    String report = Files.readString(dir.resolve("ships-apache/target/generated-sources/license/THIRD-PARTY.txt"));
    assertTrue(report.contains("(Apache-2.0)") && report.contains("test.planted:apache-library"), report);
    assertEquals(1, report.lines().filter(l -> l.contains("test.planted:")).count(), report);
  }

  private static Pattern summary(String module, String outcome) {
    return Pattern.compile(Pattern.quote(module) + " 0\\.1\\.0-SNAPSHOT \\.+ " + outcome);
  }

  /** A pom-packaged library declaring one licence. */
  private static void library(Path dir, String id, String licence, String url) throws Exception {
    Files.createDirectories(dir.resolve(id));
    Files.writeString(dir.resolve(id).resolve("pom.xml"), """
        <project xmlns="http://maven.apache.org/POM/4.0.0">
          <modelVersion>4.0.0</modelVersion>
          <groupId>test.planted</groupId><artifactId>%s</artifactId><version>1</version>
          <packaging>pom</packaging>
          <licenses><license><name>%s</name><url>%s</url></license></licenses>
        </project>
        """.formatted(id, licence, url));
  }

  /** A module inheriting the real parent POM, depending on {@code library} and running the licence check. */
  private static void shipping(Path dir, String id, String library) throws Exception {
    Files.createDirectories(dir.resolve(id));
    Files.writeString(dir.resolve(id).resolve("pom.xml"), """
        <project xmlns="http://maven.apache.org/POM/4.0.0">
          <modelVersion>4.0.0</modelVersion>
          <parent><groupId>dev.sequencer</groupId><artifactId>sequencer-parent</artifactId>
            <version>0.1.0-SNAPSHOT</version><relativePath>%s</relativePath></parent>
          <groupId>test.planted</groupId><artifactId>%s</artifactId>
          <dependencies><dependency><groupId>test.planted</groupId><artifactId>%s</artifactId><version>1</version>
            <type>pom</type></dependency></dependencies>
          <build><plugins><plugin><groupId>org.codehaus.mojo</groupId><artifactId>license-maven-plugin</artifactId>
            </plugin></plugins></build>
        </project>
        """.formatted(dir.resolve(id).toAbsolutePath().relativize(MavenChild.root().resolve("pom.xml")), id, library));
  }
}
