package dev.sequencer.cli;

import dev.sequencer.campaign.SweepRow;
import dev.sequencer.campaign.SweepRunner;
import dev.sequencer.campaign.SweepSummary;
import dev.sequencer.charts.SeasonCharts;
import dev.sequencer.io.AtomicFiles;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code sequencer sweep}: runs a grid of plans or seasons on a local thread pool. */
@Command(
    name = "sweep",
    mixinStandardHelpOptions = true,
    description = {"Run a grid: a scenario or a campaign crossed with the sweep file's axes (solver, time limit, "
        + "workers, seed, weather seed, slew model), on a local pool of cores / workers threads. Reproducible by "
        + "default (deterministic work limits): the rows do not depend on the machine's load, only wallS does.",
        "Writes runs.csv (one row per run), summary.csv (min, quartiles, median, max per axis value) and "
            + "box-AXIS.png (or .svg) per axis into the output folder. The same grid runs on Apache Spark with "
            + "the benchmarks module's SparkSweep job (docs/campaigns.md).",
        "Exit 0 when every run ran; 2 on invalid input; 3 on an internal error."},
    footer = {"", Caution.TEXT})
final class SweepCommand implements Callable<Integer> {
  @Parameters(index = "0", paramLabel = "SWEEP.json", description = "The sweep file.")
  Path sweep;

  @Option(names = {"-o", "--output-dir"}, required = true, paramLabel = "DIR", description = "Folder for runs.csv, "
      + "summary.csv and the box plots (created when missing).")
  Path outputDir;

  @Option(names = "--threads", paramLabel = "N", description = "Runs at once (default: cores / workers per run).")
  Integer threads;

  @Option(names = "--svg", description = "Draw the box plots as SVG instead of PNG.")
  boolean svg;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    if (threads != null && threads < 1) {
      throw new InputException("--threads: must be >= 1 (was " + threads + ")");
    }
    Outputs.check(Outputs.folder("--output-dir", outputDir));
    SweepRunner runner = SweepRunner.load(sweep, common.astro());
    int pool = threads != null ? threads : runner.embeddedThreads();
    out.printf(Locale.ROOT, "%d runs on %d threads%n", runner.size(), pool);
    long t0 = System.nanoTime();
    List<SweepRow> rows = runner.runAll(pool);
    StringBuilder runs = new StringBuilder(SweepRow.HEADER).append('\n');
    rows.forEach(r -> runs.append(r.csv()).append('\n'));
    AtomicFiles.writeUtf8(outputDir.resolve("runs.csv"), runs.toString());
    StringBuilder summary = new StringBuilder(SweepSummary.HEADER).append('\n');
    List<SweepSummary> sums = SweepSummary.of(rows, runner.axes());
    sums.forEach(s -> summary.append(s.csv()).append('\n'));
    AtomicFiles.writeUtf8(outputDir.resolve("summary.csv"), summary.toString());
    for (String axis : runner.axes()) {
      Path f = outputDir.resolve("box-" + axis + (svg ? ".svg" : ".png"));
      CampaignCommand.write(SeasonCharts.box(rows, axis, "priority by " + axis), f);
    }
    for (SweepSummary s : sums) {
      out.printf(Locale.ROOT, "%-12s %-14s runs %3d  median %s  [%s, %s]%n", s.axis(), s.value(), s.runs(),
          fmt(s.median()), fmt(s.q1()), fmt(s.q3()));
    }
    out.printf(Locale.ROOT, "wrote %s (runs.csv, summary.csv, %d box plots) in %.1f s%n", outputDir,
        runner.axes().size(), (System.nanoTime() - t0) * 1e-9);
    return 0;
  }

  private static String fmt(double v) {
    return String.format(Locale.ROOT, "%.1f", v);
  }
}
