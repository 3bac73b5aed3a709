package dev.sequencer.cli;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.astro.LeapSecondTable;
import java.nio.file.Files;
import java.nio.file.Path;
import picocli.CommandLine.Option;

/** Options shared by the commands that compute geometry. */
final class CommonOptionsMixin {
  @Option(
      names = "--orekit-data",
      paramLabel = "DIR",
      description = "Use a full Orekit data directory (JPL ephemerides, Earth orientation) instead of the "
          + "bundled offline data.")
  Path orekitData;

  @Option(
      names = "--leap-seconds",
      paramLabel = "FILE",
      description = "Use this leap-second file instead of the bundled table: the IERS Leap_Second.dat or the "
          + "NIST/IETF leap-seconds.list (newer than the bundled one after each IERS Bulletin C).")
  Path leapSeconds;

  AstroContext astro() {
    if (leapSeconds != null && orekitData != null) {
      throw new InputException("--leap-seconds and --orekit-data: give one or the other (an Orekit data "
          + "directory brings its own leap seconds)");
    }
    if (orekitData != null) {
      return AstroContext.fromOrekitData(orekitData);
    }
    if (leapSeconds == null) {
      return AstroContext.offline();
    }
    if (!Files.isRegularFile(leapSeconds)) {
      throw new InputException(leapSeconds + ": no such file (--leap-seconds)");
    }
    try {
      return AstroContext.offline(LeapSecondTable.read(leapSeconds));
    } catch (IllegalArgumentException e) {
      throw new InputException("--leap-seconds: " + e.getMessage());
    }
  }
}
