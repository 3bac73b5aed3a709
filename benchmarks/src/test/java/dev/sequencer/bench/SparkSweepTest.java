package dev.sequencer.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.campaign.SweepRow;
import dev.sequencer.campaign.SweepRunner;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The sweep on Spark local mode gives the embedded sweep's rows, byte for byte (wall time left out). */
class SparkSweepTest {
  /** Eight invented fields (more than 3 h of exposure in a 3 h horizon) at an invented site; horizon one night. */
  private static String scenario() {
    Random r = new Random(24);
    StringBuilder b = new StringBuilder("{ \"format\": 1, \"name\": \"spark test fields\",\n"
        + " \"horizon\": { \"start\": \"2031-04-02T02:00:00Z\", \"end\": \"2031-04-02T05:00:00Z\" },\n"
        + " \"observer\": { \"ground\": { \"latitudeDeg\": -29.9, \"longitudeDeg\": -70.8, \"altitudeM\": 2400 } },\n"
        + " \"constraints\": { \"elevationMinDeg\": 30, \"sunElevationMaxDeg\": -15 },\n"
        + " \"slew\": { \"model\": \"eigenaxis\", \"rateDegPerS\": 1.5, \"accelDegPerS2\": 0.3, \"settleS\": 10 },\n"
        + " \"requests\": [\n");
    for (int i = 0; i < 8; i++) {
      b.append(String.format(Locale.ROOT, "  { \"id\": \"K%d\", \"target\": { \"raDeg\": %.2f, \"decDeg\": %.2f }, "
          + "\"durationS\": %d, \"priority\": %d }%s%n", i + 1, 120 + r.nextDouble() * 120, -70 + r.nextDouble() * 60,
          60 * (10 + r.nextInt(30)), 1 + r.nextInt(9), i < 7 ? "," : ""));
    }
    return b.append(" ]\n}\n").toString();
  }

  @Test
  void twentyFourRunsIdenticalEmbeddedAndOnSparkLocal(@TempDir Path dir) throws Exception {
    Files.writeString(dir.resolve("night.json"), scenario());
    Files.writeString(dir.resolve("sweep.json"), """
        { "format": 1, "scenario": "night.json",
          "axes": { "solver": ["cpsat", "greedy", "best-now"], "timeLimitS": [0.1], "workers": [1], "seed": [1, 2],
                    "slew": [ { "model": "eigenaxis", "rateDegPerS": 1.5, "accelDegPerS2": 0.3, "settleS": 10 },
                              { "model": "eigenaxis", "rateDegPerS": 0.3, "accelDegPerS2": 0.05, "settleS": 30 },
                              { "model": "fixed", "seconds": 120 },
                              { "model": "fixed", "seconds": 900 } ] } }""");
    SweepRunner runner = SweepRunner.load(dir.resolve("sweep.json"), AstroContext.offline());
    assertEquals(24, runner.size());
    List<String> embedded = runner.runAll(2).stream().map(SweepRow::resultCsv).toList();
    try (SparkSession spark = SparkSweep.session("local[2]", runner)) {
      List<SweepRow> rows = SparkSweep.run(spark, dir.resolve("sweep.json"));
      assertEquals(embedded, rows.stream().map(SweepRow::resultCsv).toList());
      Path out = dir.resolve("out");
      Files.createDirectories(out);
      SparkSweep.write(spark, rows, runner.axes(), out);
      assertEquals(24, spark.read().parquet(out.resolve("runs.parquet").toString()).count());
      assertEquals(25, Files.readAllLines(out.resolve("runs.csv")).size());
    }
    // The slow slews cost priority on some setting: the rows differ along the slew axis (the sweep is real).
    assertTrue(embedded.stream().map(r -> r.split(",")[8]).distinct().count() > 1, String.join("\n", embedded));
  }
}
