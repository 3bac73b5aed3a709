package dev.sequencer.sequence.problem;

import dev.sequencer.slew.Transitions;
import java.util.List;

/**
 * The transitions of a {@link Sections} problem: between two options of one section, the section's
 * resource model (indexed by request, times shifted to the resource's own clock); from the start pointing
 * (section 0) or a section's marker to an option of that section, the resource's start-pointing leg
 * departing at its horizon start; into a marker, 0 from any earlier section; everything else impossible.
 * A path carries the resource path of its current section and starts a fresh one at each marker, so exact
 * legs, states and slews are each resource's own.
 */
final class SectionTransitions implements Transitions {
  private final List<Transitions> resources;
  private final Sections sections;
  private final int[] requestOf;

  /** {@code resources.get(r)} indexed by request; {@code requestOf[k]} the request of option k (-1 for markers). */
  SectionTransitions(List<Transitions> resources, Sections sections, int[] requestOf) {
    this.resources = List.copyOf(resources);
    this.sections = sections;
    this.requestOf = requestOf.clone();
  }

  @Override
  public int size() {
    return requestOf.length;
  }

  /** Section of {@code k}, the start pointing counting as section 0's start. */
  private int section(int k) {
    return k == START ? 0 : sections.sectionOf(k);
  }

  /** True when {@code k} is the start of its section: the start pointing or a marker. */
  private boolean opens(int k) {
    return k == START || sections.isMarker(k);
  }

  @Override
  public double boundS(int from, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS) {
    int a = section(from);
    if (sections.isMarker(to)) {
      return sections.sectionOf(to) > a ? 0 : Double.POSITIVE_INFINITY;
    }
    int b = sections.sectionOf(to);
    if (a != b) {
      return Double.POSITIVE_INFINITY;
    }
    double off = sections.offsetS(b);
    Transitions t = resources.get(b);
    if (opens(from)) {
      return t.boundS(START, requestOf[to], 0, 0, arrivalMinS - off, arrivalMaxS - off);
    }
    return t.boundS(requestOf[from], requestOf[to], departureMinS - off, departureMaxS - off, arrivalMinS - off,
        arrivalMaxS - off);
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    double[] out = new double[order.length];
    Path p = path();
    for (int q = 0; q < order.length; q++) {
      out[q] = p.legS(order[q], departureS[q], arrivalS[q]);
      if (out[q] == Double.POSITIVE_INFINITY) {
        for (int i = q; i < order.length; i++) {
          out[i] = Double.POSITIVE_INFINITY;
        }
        return out;
      }
      p = p.then(order[q], departureS[q], arrivalS[q]);
    }
    return out;
  }

  @Override
  public boolean exactMayExceedBound() {
    return resources.stream().anyMatch(Transitions::exactMayExceedBound);
  }

  @Override
  public boolean timeDependent() {
    return resources.stream().anyMatch(Transitions::timeDependent);
  }

  @Override
  public Path path() {
    return new SectionPath(0, resources.get(0).path(), START);
  }

  @Override
  public Slew slew(int from, int to, double departureS, double arrivalS) {
    if (sections.isMarker(to) || section(from) != sections.sectionOf(to)) {
      return new Slew(0, departureS, List.of());
    }
    int b = sections.sectionOf(to);
    double off = sections.offsetS(b);
    Slew s = resources.get(b).slew(opens(from) ? START : requestOf[from], requestOf[to],
        opens(from) ? 0 : departureS - off, arrivalS - off);
    return new Slew(s.seconds(), opens(from) ? departureS : s.departureS() + off, s.via());
  }

  /** A resource path inside one section. */
  private final class SectionPath implements Path {
    private final int section;
    private final Path inner;
    private final int lastTask;

    SectionPath(int section, Path inner, int lastTask) {
      this.section = section;
      this.inner = inner;
      this.lastTask = lastTask;
    }

    @Override
    public int last() {
      return lastTask;
    }

    @Override
    public double legS(int to, double departureS, double arrivalS) {
      if (sections.isMarker(to)) {
        return sections.sectionOf(to) > section ? 0 : Double.POSITIVE_INFINITY;
      }
      if (sections.sectionOf(to) != section) {
        return Double.POSITIVE_INFINITY;
      }
      double off = sections.offsetS(section);
      return inner.legS(requestOf[to], opens(lastTask) ? 0 : departureS - off, arrivalS - off);
    }

    @Override
    public Path then(int to, double departureS, double arrivalS) {
      if (sections.isMarker(to)) {
        int b = sections.sectionOf(to);
        return new SectionPath(b, resources.get(b).path(), to);
      }
      double off = sections.offsetS(section);
      return new SectionPath(section, inner.then(requestOf[to], opens(lastTask) ? 0 : departureS - off,
          arrivalS - off), to);
    }

    @Override
    public Object state() {
      Object s = inner.state();
      return s == null ? null : List.of(section, s);
    }
  }
}
