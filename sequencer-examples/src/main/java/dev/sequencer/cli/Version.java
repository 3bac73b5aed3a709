package dev.sequencer.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;
import picocli.CommandLine.IVersionProvider;

/** What {@code -V}/{@code --version} prints, on every command: the build's version, the Java and platform. */
final class Version implements IVersionProvider {
  /** The project version the build wrote into {@code version.properties}. */
  static String number() {
    Properties p = new Properties();
    try (InputStream in = Version.class.getResourceAsStream("version.properties")) {
      if (in == null) {
        throw new IllegalStateException("version.properties is missing from the jar");
      }
      p.load(in);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return p.getProperty("version");
  }

  @Override
  public String[] getVersion() {
    return new String[] {"sequencer " + number(),
        "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vendor") + "), "
            + System.getProperty("os.name") + " " + System.getProperty("os.arch")};
  }
}
