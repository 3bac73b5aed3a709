package dev.sequencer.bench;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.campaign.SweepRow;
import dev.sequencer.campaign.SweepRunner;
import dev.sequencer.campaign.SweepSummary;
import dev.sequencer.io.AtomicFiles;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.stream.IntStream;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructType;

/**
 * The sweep on Apache Spark: the same run function as {@code sequencer sweep} ({@link SweepRunner#run}),
 * one Spark task per run, {@code spark.task.cpus} = the CP-SAT workers of a run. Each executor reads the
 * sweep file and its input once (they must be readable at the same path on every node: a shared folder,
 * or {@code --files}) and caches them per JVM. Writes runs.csv and summary.csv (the embedded command's
 * files, rows in run order) and runs.parquet into the output folder.
 *
 * <pre>
 * spark-submit --class dev.sequencer.bench.SparkSweep --master spark://HOST:7077 \
 *   benchmarks/target/benchmarks.jar SWEEP.json OUT_DIR
 * </pre>
 */
public final class SparkSweep {
  private static final Map<String, SweepRunner> RUNNERS = new ConcurrentHashMap<>();

  private SparkSweep() {}

  /** The runner of one sweep file, read once per JVM (driver and executors alike). */
  static SweepRunner runner(String sweepFile) {
    return RUNNERS.computeIfAbsent(sweepFile, f -> SweepRunner.load(Path.of(f), AstroContext.offline()));
  }

  /** Runs every row of the sweep on {@code spark}; rows in run order. */
  public static List<SweepRow> run(SparkSession spark, Path sweepFile) {
    String file = sweepFile.toAbsolutePath().toString();
    int n = runner(file).size();
    JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
    List<Integer> indices = IntStream.range(0, n).boxed().toList();
    List<SweepRow> rows = new ArrayList<>(jsc.parallelize(indices, Math.max(1, n))
        .map(i -> runner(file).run(i)).collect());
    rows.sort(Comparator.comparingInt(SweepRow::run));
    return rows;
  }

  /** The rows as a Spark table (the CSV's columns). */
  public static Dataset<Row> table(SparkSession spark, List<SweepRow> rows) {
    StructType schema = new StructType()
        .add("run", DataTypes.IntegerType).add("solver", DataTypes.StringType)
        .add("timeLimitS", DataTypes.DoubleType).add("workers", DataTypes.IntegerType)
        .add("seed", DataTypes.IntegerType).add("weatherSeed", DataTypes.LongType, true)
        .add("slew", DataTypes.StringType).add("status", DataTypes.StringType)
        .add("priority", DataTypes.DoubleType).add("bound", DataTypes.DoubleType)
        .add("remaining", DataTypes.DoubleType).add("slewS", DataTypes.DoubleType)
        .add("observations", DataTypes.IntegerType).add("wallS", DataTypes.DoubleType);
    List<Row> out = new ArrayList<>();
    for (SweepRow r : rows) {
      out.add(RowFactory.create(r.run(), r.solver(), r.timeLimitS(), r.workers(), r.seed(), r.weatherSeed(), r.slew(),
          r.status(), r.priority(), r.bound(), r.remaining(), r.slewS(), r.observations(), r.wallS()));
    }
    return spark.createDataFrame(out, schema);
  }

  /** Writes runs.csv, summary.csv and runs.parquet into {@code dir}. */
  public static void write(SparkSession spark, List<SweepRow> rows, List<String> axes, Path dir) {
    StringBuilder runs = new StringBuilder(SweepRow.HEADER).append('\n');
    rows.forEach(r -> runs.append(r.csv()).append('\n'));
    AtomicFiles.writeUtf8(dir.resolve("runs.csv"), runs.toString());
    StringBuilder summary = new StringBuilder(SweepSummary.HEADER).append('\n');
    SweepSummary.of(rows, axes).forEach(s -> summary.append(s.csv()).append('\n'));
    AtomicFiles.writeUtf8(dir.resolve("summary.csv"), summary.toString());
    table(spark, rows).coalesce(1).write().mode("overwrite").parquet(dir.resolve("runs.parquet").toString());
  }

  /** A session for this sweep: {@code spark.task.cpus} = the most CP-SAT workers any run uses. */
  public static SparkSession session(String master, SweepRunner runner) {
    int cpus = 1;
    for (int i = 0; i < runner.size(); i++) {
      cpus = Math.max(cpus, runner.workers(i));
    }
    SparkConf conf = new SparkConf().setAppName("sequencer sweep").set("spark.task.cpus", Integer.toString(cpus))
        .set("spark.ui.enabled", "false");
    if (master != null) {
      conf.setMaster(master);
    }
    return SparkSession.builder().config(conf).getOrCreate();
  }

  /** Usage: {@code SparkSweep SWEEP.json OUT_DIR [MASTER]} (MASTER only outside spark-submit, e.g. local[2]). */
  public static void main(String[] args) throws Exception {
    if (args.length < 2) {
      System.err.println("usage: SparkSweep SWEEP.json OUT_DIR [MASTER]");
      System.exit(2);
    }
    Path sweep = Path.of(args[0]);
    Path out = Path.of(args[1]);
    java.nio.file.Files.createDirectories(out);
    SweepRunner runner = runner(sweep.toAbsolutePath().toString());
    try (SparkSession spark = session(args.length > 2 ? args[2] : null, runner)) {
      long t0 = System.nanoTime();
      List<SweepRow> rows = run(spark, sweep);
      write(spark, rows, runner.axes(), out);
      System.out.printf(java.util.Locale.ROOT, "%d runs on Spark in %.1f s; wrote %s%n", rows.size(),
          (System.nanoTime() - t0) * 1e-9, out);
    }
  }
}
