package dev.sequencer.visibility;

import java.util.ArrayList;
import java.util.List;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.events.EventDetector;
import org.orekit.propagation.events.EventsLogger;
import org.orekit.time.AbsoluteDate;

/**
 * Reference windows from Orekit's own event detection on a separate propagation: the intervals of
 * [start, end] where the detector's g function is non-negative, in seconds from {@code start}. Shared by
 * the visibility tests and the visibility benchmark (test-jar).
 */
public final class OrekitReference {
  private OrekitReference() {}

  /** The detector must continue on events (ContinueOnEvent handler). Windows shorter than 1 ms are dropped. */
  public static List<double[]> windows(Propagator p, EventDetector detector, AbsoluteDate start, AbsoluteDate end) {
    EventsLogger logger = new EventsLogger();
    p.addEventDetector(logger.monitorDetector(detector));
    boolean inside = detector.g(p.propagate(start)) >= 0;
    logger.clearLoggedEvents();
    p.propagate(start, end);
    List<double[]> out = new ArrayList<>();
    double open = inside ? 0 : Double.NaN;
    for (EventsLogger.LoggedEvent e : logger.getLoggedEvents()) {
      double t = e.getDate().durationFrom(start);
      if (e.isIncreasing()) {
        open = t;
      } else if (!Double.isNaN(open)) {
        out.add(new double[] {open, t});
        open = Double.NaN;
      }
    }
    if (!Double.isNaN(open)) {
      out.add(new double[] {open, end.durationFrom(start)});
    }
    out.removeIf(w -> w[1] - w[0] < 1e-3);
    return out;
  }
}
