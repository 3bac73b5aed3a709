package dev.sequencer.examples;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/**
 * How to embed the library: read a scenario (every rule of the format checked), hand it to the
 * {@link Planner} façade — which computes the visibility windows, builds the slew transitions, plans and
 * re-checks the plan independently, all within the time limit — and write the timeline. The three
 * example programs call {@link #plan} on their own scenario.
 */
public final class Embedding {
  private Embedding() {}

  /**
   * What one run produced: the scenario, its windows, the sequencer's answer and its timeline. A result
   * with a plan has passed the full validator (the physics re-check included); an invalid plan is never
   * returned (the façade raises {@link IllegalStateException} instead).
   */
  public record Outcome(Scenario scenario, List<RequestWindows> windows, SequencerResult result,
      Timeline timeline) {}

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
    PlanOutcome o = Planner.plan(scenario, ctx, options);
    return new Outcome(scenario, o.geometry().windows(), o.result(), o.timeline());
  }

  /** Prints a one-line summary and, when {@code output} is not null, writes the timeline file there. */
  public static void report(Outcome o, Path output) {
    System.out.printf(Locale.ROOT, "%s%n  %s: %d of %d requests scheduled, priority %.1f, bound %s, slew %.0f s%s%n",
        o.scenario().name(), o.timeline().status(), o.timeline().observations().size(),
        o.scenario().requests().size(), o.timeline().priority(),
        o.timeline().bound() == null ? "-" : String.format(Locale.ROOT, "%.1f", o.timeline().bound()),
        o.timeline().slewSeconds(), o.result().hasPlan() ? ", re-checked: valid" : "");
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
