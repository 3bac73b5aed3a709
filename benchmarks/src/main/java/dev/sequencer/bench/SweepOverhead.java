package dev.sequencer.bench;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.campaign.SweepRow;
import dev.sequencer.campaign.SweepRunner;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.apache.spark.sql.SparkSession;

/**
 * The same sweep embedded (thread pool), on Spark local mode, and embedded again, one after the other in one
 * JVM (the second embedded run shows the warm-up and load drift): wall times, the ratio of Spark to the mean
 * embedded time, and whether the result rows (wall time left out) are identical. Needs Spark on the
 * class path (provided scope: run with the test class path or spark-submit).
 *
 * <p>Usage: {@code SweepOverhead SWEEP.json [threads=2]}.
 */
public final class SweepOverhead {
  private SweepOverhead() {}

  public static void main(String[] args) throws Exception {
    Path sweep = Path.of(args[0]);
    int threads = args.length > 1 ? Integer.parseInt(args[1]) : 2;
    SweepRunner runner = SweepRunner.load(sweep, AstroContext.offline());
    runner.run(0); // warm up: native solver, Orekit data
    long t0 = System.nanoTime();
    List<SweepRow> embedded = runner.runAll(threads);
    double embeddedS = (System.nanoTime() - t0) * 1e-9;
    try (SparkSession spark = SparkSweep.session("local[" + threads + "]", runner)) {
      long t1 = System.nanoTime();
      List<SweepRow> onSpark = SparkSweep.run(spark, sweep);
      double sparkS = (System.nanoTime() - t1) * 1e-9;
      long t2 = System.nanoTime();
      List<SweepRow> again = runner.runAll(threads);
      double againS = (System.nanoTime() - t2) * 1e-9;
      boolean same = embedded.stream().map(SweepRow::resultCsv).toList()
          .equals(onSpark.stream().map(SweepRow::resultCsv).toList())
          && again.stream().map(SweepRow::resultCsv).toList().equals(embedded.stream().map(SweepRow::resultCsv).toList());
      System.out.printf(Locale.ROOT, "%d runs, %d threads: embedded %.1f s, Spark local %.1f s (session start "
          + "excluded), embedded again %.1f s; ratio Spark / mean embedded %.2f; rows identical: %s%n",
          embedded.size(), threads, embeddedS, sparkS, againS, sparkS / ((embeddedS + againS) / 2), same);
    }
  }
}
