package dev.sequencer.cli;

import dev.sequencer.astro.AstroContext;
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

  AstroContext astro() {
    return orekitData == null ? AstroContext.offline() : AstroContext.fromOrekitData(orekitData);
  }
}
