package dev.sequencer.bench;

/** Entry point of the benchmarks jar: passes the command line to JMH (e.g. {@code SlewBenchmark -f 1}). */
public final class BenchMain {
  private BenchMain() {}

  public static void main(String[] args) throws Exception {
    org.openjdk.jmh.Main.main(args);
  }
}
