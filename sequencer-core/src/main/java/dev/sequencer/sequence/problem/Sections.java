package dev.sequencer.sequence.problem;

import dev.sequencer.model.RequestWindows;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Several resources (format addition A6) as one sequence: the planner's time axis holds one section per
 * resource, one after the other, and a plan is a single sequence that visits the sections in order. Section
 * r covers [{@code offsetS(r)}, {@code offsetS(r)} + horizon] and holds one task per request resource r may
 * observe (an <em>option</em>), with that resource's windows shifted by the offset; the transitions between
 * two options of one section are that resource's, between sections impossible. Section r ≥ 1 opens with a
 * <em>marker</em>: a required, zero-length, zero-prize task pinned at the section's offset, from which the
 * next leg is the resource's start-pointing leg at the horizon start. Every sequence that holds all markers
 * therefore splits into one sequence per resource, each with exactly the timing rules of that resource alone
 * (the giant-tour representation of vehicle routing, with time reset at each marker).
 *
 * <p>The options of one request's visit (the request itself when it is observed once) are <em>alternatives</em>
 * (a unit): at most one is scheduled, exactly one when the request is required ({@link #unitRequired}); the
 * options themselves are not marked required. This class owns that reading; {@link Structure#prune} keeps the
 * first option of each unit in time order, and numbers the visits of a request in time order whatever
 * resources observe them (A4, A6). Immutable.
 */
public final class Sections {
  private final List<String> resourceIds;
  private final long[] offsetS;
  private final int[] sectionOf;
  private final boolean[] marker;
  private final int[] unitOf;
  private final int[] requestOf;
  private final int[][] units;
  private final boolean[] unitRequired;
  private final int[] markerOf;
  private List<List<RequestWindows>> windows = List.of();
  private List<Transitions> transitions = List.of();

  /**
   * Sections from, per task, its section, whether it is a marker and its unit (the request index; -1 for
   * markers), with the offsets of the sections and which units are required: every request observed once.
   */
  public Sections(List<String> resourceIds, long[] offsetS, int[] sectionOf, boolean[] marker, int[] unitOf,
      boolean[] unitRequired) {
    this(resourceIds, offsetS, sectionOf, marker, unitOf, unitOf, unitRequired);
  }

  /**
   * As {@link #Sections(List, long[], int[], boolean[], int[], boolean[])}, with visits (A4): {@code unitOf}
   * numbers the (request, visit) pairs, {@code requestOf} gives each task's request index (-1 for markers).
   */
  public Sections(List<String> resourceIds, long[] offsetS, int[] sectionOf, boolean[] marker, int[] unitOf,
      int[] requestOf, boolean[] unitRequired) {
    this.requestOf = requestOf.clone();
    this.resourceIds = List.copyOf(resourceIds);
    this.offsetS = offsetS.clone();
    this.sectionOf = sectionOf.clone();
    this.marker = marker.clone();
    this.unitOf = unitOf.clone();
    this.unitRequired = unitRequired.clone();
    List<List<Integer>> byUnit = new ArrayList<>();
    for (int u = 0; u < unitRequired.length; u++) {
      byUnit.add(new ArrayList<>());
    }
    markerOf = new int[offsetS.length];
    Arrays.fill(markerOf, -1);
    for (int k = 0; k < unitOf.length; k++) {
      if (marker[k]) {
        markerOf[sectionOf[k]] = k;
      } else {
        byUnit.get(unitOf[k]).add(k);
      }
    }
    units = new int[byUnit.size()][];
    for (int u = 0; u < units.length; u++) {
      units[u] = byUnit.get(u).stream().mapToInt(Integer::intValue).toArray();
    }
  }

  /** This with each resource's windows and request transitions as given (for the plan's own check). */
  Sections withInputs(List<List<RequestWindows>> resourceWindows, List<Transitions> resourceTransitions) {
    Sections c = new Sections(resourceIds, offsetS, sectionOf, marker, unitOf, requestOf, unitRequired);
    c.windows = List.copyOf(resourceWindows);
    c.transitions = List.copyOf(resourceTransitions);
    return c;
  }

  /** The windows of the requests resource r may observe, as given to the problem. */
  public List<RequestWindows> windows(int r) {
    return windows.get(r);
  }

  /** Resource r's transitions, indexed by request (configuration changes included). */
  public Transitions transitions(int r) {
    return transitions.get(r);
  }

  /** Number of resources (sections). */
  public int count() {
    return offsetS.length;
  }

  /** Id of the resource of section r. */
  public String resourceId(int r) {
    return resourceIds.get(r);
  }

  /** The resource ids in file order. */
  public List<String> resourceIds() {
    return resourceIds;
  }

  /** Planner seconds at which section r's horizon starts. */
  public long offsetS(int r) {
    return offsetS[r];
  }

  /** Section (resource index) of task k. */
  public int sectionOf(int k) {
    return sectionOf[k];
  }

  /** True when task k is the marker opening a section. */
  public boolean isMarker(int k) {
    return marker[k];
  }

  /** The marker task of section r (-1 for section 0, which has none). */
  public int markerOf(int r) {
    return markerOf[r];
  }

  /** The unit (request index) of option k, -1 for a marker. */
  public int unitOf(int k) {
    return unitOf[k];
  }

  /** Every option of request q (scenario index): of each of its visits, on every resource, in task order. */
  public int[] requestOptions(int q) {
    return java.util.stream.IntStream.range(0, requestOf.length).filter(k -> requestOf[k] == q).toArray();
  }

  /** Number of units. */
  public int unitCount() {
    return units.length;
  }

  /** The options of unit u, in section order. */
  public int[] options(int u) {
    return units[u];
  }

  /** True when unit u must be scheduled (its request is required). */
  public boolean unitRequired(int u) {
    return unitRequired[u];
  }

  /** Task k's seconds from its own resource's horizon start for planner seconds {@code s}. */
  public long localS(int k, long s) {
    return s - offsetS[sectionOf[k]];
  }

  /** Required units with no option in {@code in} (markers are tasks of their own: not counted here). */
  public int unitsMissing(boolean[] in) {
    int missing = 0;
    for (int u = 0; u < units.length; u++) {
      if (!unitRequired[u]) {
        continue;
      }
      boolean held = false;
      for (int k : units[u]) {
        held |= in[k];
      }
      missing += held ? 0 : 1;
    }
    return missing;
  }
}
