package dev.sequencer.cli;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.WindowsFile;
import dev.sequencer.model.Scenario;
import dev.sequencer.visibility.SkyValues;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** The contact plan a station reads: the passes of orbiting targets over a ground site, for {@code windows} and {@code inspect}. */
final class ContactPlan {
  private ContactPlan() {}

  /**
   * The passes of {@code s}'s orbiting targets over its ground site, by request id (none elsewhere): rise and
   * set at the geometric horizon, as in the report's pass table.
   */
  static Map<String, List<WindowsFile.Pass>> passes(Scenario s, AstroContext ctx) {
    Map<String, List<WindowsFile.Pass>> out = new HashMap<>();
    boolean orbiting = s.requests().stream().anyMatch(q -> q.target() instanceof dev.sequencer.model.OrbitingTarget);
    if (!(s.observer() instanceof dev.sequencer.model.GroundSite) || !orbiting) {
      return out;
    }
    SkyValues sky = SkyValues.of(s, ctx);
    for (dev.sequencer.model.Request q : s.requests()) {
      if (q.target() instanceof dev.sequencer.model.OrbitingTarget) {
        out.put(q.id(), sky.passes(q, 0.0).stream().map(p -> new WindowsFile.Pass(p.rise(), p.culmination(),
            p.culminationElevationDeg(), p.set())).toList());
      }
    }
    return out;
  }
}
