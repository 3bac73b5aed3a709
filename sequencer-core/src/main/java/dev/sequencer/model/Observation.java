package dev.sequencer.model;

import java.time.Instant;
import java.util.List;
import java.util.Objects;

/**
 * One scheduled observation: its interval, the transition time before it (from the previous
 * observation or the start pointing), the value collected for flexible requests ({@code null}
 * otherwise) and the re-planning state ({@code null} means planned).
 *
 * <p>Keep-outs during slews (spec A3): {@code slewStart} is the instant the slew before this observation
 * departs ({@code null}: any departure within the gap that keeps the minima), and {@code slewVia} the
 * directions an eigenaxis slew passes through (empty: the direct great-circle arc); then the slew is a
 * chain of rest-to-rest legs through them and {@code slewSeconds} is the sum of the legs plus one settle.
 * {@code visit} (A4): the visit number of a request observed several times (1, 2, … in time order),
 * {@code null} otherwise. With configurations (A5) {@code slewSeconds} is the whole transition. {@code resource}
 * (A6): the resource that makes it, {@code null} with one observer; then {@code slewSeconds} is the
 * transition from the previous observation on the same resource.
 */
public record Observation(String id, Instant start, Instant end, double slewSeconds, Double value, String state,
    Instant slewStart, List<RaDec> slewVia, Integer visit, String resource) {
  /** Re-planning states of the spec's extension. */
  public static final String DONE = "done";
  public static final String RUNNING = "running";
  public static final String PLANNED = "planned";

  public Observation {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(start, "start");
    Objects.requireNonNull(end, "end");
    if (end.isBefore(start)) {
      throw new IllegalArgumentException("observation " + id + ": end " + end + " is before start " + start);
    }
    Checks.finite("slewSeconds", slewSeconds);
    slewVia = slewVia == null ? List.of() : List.copyOf(slewVia);
    if (slewStart != null && slewStart.isAfter(start)) {
      throw new IllegalArgumentException("observation " + id + ": slewStart " + slewStart + " is after start " + start);
    }
    if (visit != null && visit < 1) {
      throw new IllegalArgumentException("observation " + id + ": visit must be >= 1 (was " + visit + ")");
    }
  }

  /** An observation of a scenario with one observer (no {@code resource}, A6). */
  public Observation(String id, Instant start, Instant end, double slewSeconds, Double value, String state,
      Instant slewStart, List<RaDec> slewVia, Integer visit) {
    this(id, start, end, slewSeconds, value, state, slewStart, slewVia, visit, null);
  }

  /** A copy made by this resource (A6; {@code null}: the one observer). */
  public Observation withResource(String newResource) {
    return new Observation(id, start, end, slewSeconds, value, state, slewStart, slewVia, visit, newResource);
  }

  /** An observation that is not one of several visits. */
  public Observation(String id, Instant start, Instant end, double slewSeconds, Double value, String state,
      Instant slewStart, List<RaDec> slewVia) {
    this(id, start, end, slewSeconds, value, state, slewStart, slewVia, null);
  }

  /** A copy with this visit number (A4; {@code null}: not one of several visits). */
  public Observation withVisit(Integer newVisit) {
    return new Observation(id, start, end, slewSeconds, value, state, slewStart, slewVia, newVisit, resource);
  }

  /** An observation with no slew departure instant and a direct slew. */
  public Observation(String id, Instant start, Instant end, double slewSeconds, Double value, String state) {
    this(id, start, end, slewSeconds, value, state, null, List.of());
  }

  /** A copy with the slew's departure instant and waypoints (spec A3). */
  public Observation withSlew(Instant departure, List<RaDec> via) {
    return new Observation(id, start, end, slewSeconds, value, state, departure, via, visit, resource);
  }

  /** A planned fixed-duration observation. */
  public static Observation of(String id, Instant start, Instant end, double slewSeconds) {
    return new Observation(id, start, end, slewSeconds, null, null);
  }

  /** Duration in seconds. */
  public double durationS() {
    return new TimeWindow(start, end).durationS();
  }
}
