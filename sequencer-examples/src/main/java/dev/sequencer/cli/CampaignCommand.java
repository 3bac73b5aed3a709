package dev.sequencer.cli;

import dev.sequencer.campaign.CampaignResult;
import dev.sequencer.campaign.CampaignSimulator;
import dev.sequencer.campaign.CampaignTables;
import dev.sequencer.campaign.Strategy;
import dev.sequencer.charts.ChartFiles;
import dev.sequencer.charts.SeasonCharts;
import dev.sequencer.io.AtomicFiles;
import dev.sequencer.io.CampaignReader;
import dev.sequencer.model.Campaign;
import dev.sequencer.sequence.SequencerOptions;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.Callable;
import org.jfree.chart.JFreeChart;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code sequencer campaign}: plays a season night by night against seeded weather, one run per strategy. */
@Command(
    name = "campaign",
    mixinStandardHelpOptions = true,
    description = {"Play a season: each night's horizon from the darkness rule, a plan, execution against the "
        + "campaign's seeded weather with a re-plan after each loss, what was done carried forward to the next "
        + "night (visits, exposure), priorities ageing if the campaign says so. One season per strategy, on the "
        + "same nights and the same weather.",
        "Writes the per-night CSV, the totals CSV and the completion picture (collected and remaining value "
            + "against the night, one colour per strategy). See docs/campaigns.md.",
        "Exit 0 when the seasons ran; 2 on invalid input; 3 on an internal error."},
    footer = {"", Caution.TEXT})
final class CampaignCommand implements Callable<Integer> {
  @Parameters(index = "0", paramLabel = "CAMPAIGN.json", description = "The campaign file.")
  Path campaign;

  @Option(names = "--strategy", split = ",", paramLabel = "NAME", description = "cpsat, greedy, best-now (several: "
      + "comma-separated; default all three).")
  List<String> strategies = List.of("cpsat", "greedy", "best-now");

  @Option(names = "--nights-csv", paramLabel = "FILE", description = "Write one row per night and strategy here.")
  Path nightsCsv;

  @Option(names = "--totals-csv", paramLabel = "FILE", description = "Write one row of totals per strategy here.")
  Path totalsCsv;

  @Option(names = "--chart", paramLabel = "FILE.png|FILE.svg", description = "Draw the completion picture here.")
  Path chart;

  @Mixin SeasonSolverOptions solverOptions;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    List<Strategy> chosen = strategies(strategies);
    Outputs.check(Outputs.file("--nights-csv", nightsCsv), Outputs.file("--totals-csv", totalsCsv),
        Outputs.file("--chart", chart));
    if (chart != null) {
      SeasonSolverOptions.checkChartName("--chart", chart);
    }
    CampaignReader.Result in = CampaignReader.read(campaign);
    in.warnings().forEach(w -> out.println("warning: " + w));
    Campaign c = in.campaign();
    SequencerOptions options = solverOptions.options(in.scenario().solverOrDefaults());
    CampaignSimulator sim = new CampaignSimulator(c, in.scenario(), common.astro(), options);
    List<CampaignResult> results = new ArrayList<>();
    for (Strategy s : chosen) {
      CampaignResult r = sim.run(s);
      results.add(r);
      out.printf(Locale.ROOT, "%-9s collected %.1f of %.1f (remaining %.1f), %d of %d requests complete, "
          + "%d observations, %d lost attempts, %d re-plans, %.1f s%n", s.label(), r.collected(), r.programmeValue(),
          r.remaining(), r.completed(), r.requests(), r.executed(), r.failedAttempts(), r.replans(), r.wallS());
    }
    if (nightsCsv != null) {
      AtomicFiles.writeUtf8(nightsCsv, CampaignTables.nightsCsv(results));
      out.println("wrote " + nightsCsv);
    }
    if (totalsCsv != null) {
      AtomicFiles.writeUtf8(totalsCsv, CampaignTables.totalsCsv(results));
      out.println("wrote " + totalsCsv);
    }
    if (chart != null) {
      String title = (c.name() == null ? "campaign" : c.name()) + ": programme completion";
      write(SeasonCharts.completion(results, title), chart);
      out.println("wrote " + chart);
    }
    return 0;
  }

  static void write(JFreeChart ch, Path file) {
    if (file.toString().toLowerCase(Locale.ROOT).endsWith(".svg")) {
      ChartFiles.svg(ch, SeasonCharts.WIDTH_PX, SeasonCharts.HEIGHT_PX, file);
    } else {
      ChartFiles.png(ch, SeasonCharts.WIDTH_PX, SeasonCharts.HEIGHT_PX, file);
    }
  }

  static List<Strategy> strategies(List<String> names) {
    Set<Strategy> out = new LinkedHashSet<>();
    for (String n : names) {
      if (n.isBlank()) {
        continue;
      }
      try {
        out.add(Strategy.of(n));
      } catch (IllegalArgumentException e) {
        throw new InputException("--strategy: " + e.getMessage());
      }
    }
    if (out.isEmpty()) {
      throw new InputException("--strategy: name at least one of cpsat, greedy, best-now (was empty)");
    }
    return List.copyOf(out);
  }
}
