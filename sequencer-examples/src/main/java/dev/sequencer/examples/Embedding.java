package dev.sequencer.examples;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.PlanningProblem;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.slew.SlewModel;
import dev.sequencer.slew.Transitions;
import dev.sequencer.validate.PlanValidator;
import dev.sequencer.visibility.PointingTracks;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.VisibilityCalculator;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/**
 * How to embed the library, step by step: read a scenario, compute visibility windows, build the slew
 * transitions, plan, re-check independently, write the timeline. The three example programs call
 * {@link #plan} on their own scenario.
 */
public final class Embedding {
  private Embedding() {}

  /** What one run produced: the scenario, its windows, the sequencer's answer and the validator's findings. */
  public record Outcome(Scenario scenario, List<RequestWindows> windows, SequencerResult result,
      Timeline timeline, List<String> violations) {}

  /** Reads a bundled scenario from the classpath (for example "/scenarios/ground-night-queue.json"). */
  public static Scenario bundled(String resource) {
    try (InputStream in = Embedding.class.getResourceAsStream(resource)) {
      if (in == null) {
        throw new IllegalArgumentException("no bundled scenario " + resource);
      }
      ScenarioReader.Result r = ScenarioReader.read(in); // every rule of the format checked, problems named by path
      r.warnings().forEach(w -> System.err.println("warning: " + w));
      return r.scenario();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Runs the whole chain on {@code scenario}. */
  public static Outcome plan(Scenario scenario, AstroContext ctx, SequencerOptions options) {
    // 1. Visibility: when each request's target satisfies every constraint (Orekit geometry inside).
    List<RequestVisibility> visibility = new VisibilityCalculator(ctx).compute(scenario);
    List<RequestWindows> windows = visibility.stream().map(RequestVisibility::toWindows).toList();

    // 2. Slews: the scenario's model turned into transition times between the requests' pointing tracks.
    //    The fixed and matrix models only need the number of requests; eigenaxis and alt-az need the tracks.
    SlewModel slew = SlewModel.of(scenario.slew());
    boolean sizeOnly = scenario.slew() instanceof SlewSettings.Fixed || scenario.slew() instanceof SlewSettings.Matrix;
    Transitions transitions = sizeOnly
        ? slew.transitions(java.util.Collections.nCopies(scenario.requests().size(), null), null)
        : slew.transitions(PointingTracks.of(scenario, ctx), PointingTracks.start(scenario, ctx));

    // 3. Plan: choose, order and time the observations (CP-SAT, or the greedy baseline).
    PlanningProblem problem = PlanningProblem.of(scenario, windows, transitions);
    SequencerResult result = new Sequencer().plan(problem, options);
    Timeline timeline = result.toTimeline();

    // 4. Re-check with the independent validator: it shares no code with the sequencer.
    List<String> violations = PlanValidator.of(scenario, windows, transitions).violations(timeline);
    return new Outcome(scenario, windows, result, timeline, violations);
  }

  /** Prints a one-line summary and, when {@code output} is not null, writes the timeline file there. */
  public static void report(Outcome o, Path output) {
    System.out.printf(Locale.ROOT, "%s%n  %s: %d of %d requests scheduled, priority %.1f, bound %s, slew %.0f s, "
            + "re-check: %s%n", o.scenario().name(), o.timeline().status(), o.timeline().observations().size(),
        o.scenario().requests().size(), o.timeline().priority(),
        o.timeline().bound() == null ? "-" : String.format(Locale.ROOT, "%.1f", o.timeline().bound()),
        o.timeline().slewSeconds(), o.violations().isEmpty() ? "valid" : o.violations());
    if (output != null) {
      TimelineFile.write(o.timeline(), output); // atomic: temporary file, then move
      System.out.println("  wrote " + output);
    }
  }

  /** Options for a quick run: {@code timeLimitS} seconds, 2 workers. */
  static SequencerOptions quick(Scenario s, double timeLimitS) {
    return SequencerOptions.from(s.solverOrDefaults()).withTimeLimitS(timeLimitS).withWorkers(2);
  }

  /** Arguments: optional output file, optional time limit in seconds. */
  static void main(String resource, String[] args, double defaultTimeLimitS) {
    Scenario s = bundled(resource);
    Path out = args.length > 0 ? Path.of(args[0]) : null;
    double limit = args.length > 1 ? Double.parseDouble(args[1]) : defaultTimeLimitS;
    report(plan(s, AstroContext.offline(), quick(s, limit)), out);
  }
}
