package dev.sequencer.model;

import java.util.List;
import java.util.Objects;

/**
 * A grid of runs (the sweep file, docs/campaigns.md): one scenario or one campaign ({@code inputFile},
 * relative to the sweep file; {@code campaign} tells which) crossed with every axis. An empty axis keeps the
 * input's own setting. {@code solvers}: cpsat, greedy, best-now; {@code timeLimitsS}: the solver's limit
 * (in reproducible mode CP-SAT's deterministic work units); {@code slews}: slew models replacing the
 * scenario's; {@code weatherSeeds}: campaigns only. {@code reproducible}: deterministic work limits (the
 * default), so a run's result does not depend on the machine's load.
 */
public record Sweep(int format, String name, String inputFile, boolean campaign, List<String> solvers,
    List<Double> timeLimitsS, List<Integer> workers, List<Integer> seeds, List<Long> weatherSeeds,
    List<SlewSettings> slews, boolean reproducible) {
  /** The only sweep format version this library reads. */
  public static final int FORMAT = 1;

  public Sweep {
    Objects.requireNonNull(inputFile, "inputFile");
    solvers = List.copyOf(solvers);
    timeLimitsS = List.copyOf(timeLimitsS);
    workers = List.copyOf(workers);
    seeds = List.copyOf(seeds);
    weatherSeeds = List.copyOf(weatherSeeds);
    slews = List.copyOf(slews);
  }
}
