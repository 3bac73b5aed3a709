package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/** Runs the command line in-process and captures exit code, stdout and stderr (reliability tests). */
final class Runs {
  private Runs() {}

  /** One finished run. */
  record Run(List<String> args, int code, String out, String err) {
    /** Everything printed, for failure messages. */
    String all() {
      return "args " + args + "\nexit " + code + "\n--- stdout\n" + out + "--- stderr\n" + err;
    }
  }

  static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = SequencerCli.execute(new PrintWriter(out), new PrintWriter(err), args);
    return new Run(List.of(args), code, out.toString(), err.toString());
  }

  /** Fails when the run printed a stack trace or an exception's class name. */
  static void assertNoStackTrace(Run r) {
    String both = r.out() + r.err();
    assertFalse(both.contains("\tat "), () -> "stack trace printed\n" + r.all());
    assertFalse(both.contains("Exception"), () -> "exception name printed\n" + r.all());
  }

  /**
   * The arguments that make each scenario-reading command read {@code scenario}: every such command of
   * {@link SequencerCli}. {@code timeline} is a well-formed timeline for {@code check}; {@code dir} takes
   * the outputs, which must not appear when the input is bad.
   */
  static List<List<String>> everyScenarioCommand(Path scenario, Path timeline, Path dir) {
    String s = scenario.toString();
    List<List<String>> out = new ArrayList<>();
    out.add(List.of("inspect", s));
    out.add(List.of("windows", s, "-o", dir.resolve("w.json").toString()));
    out.add(List.of("plan", s, "--time-limit", "2", "--workers", "1", "-o", dir.resolve("t.json").toString()));
    out.add(List.of("plan", s, "--solver", "greedy", "-o", dir.resolve("g.json").toString()));
    out.add(List.of("check", s, timeline.toString()));
    out.add(List.of("report", s, timeline.toString(), "-o", dir.resolve("night.html").toString()));
    out.add(List.of("replan", s, "--previous", timeline.toString(), "--now", "2031-01-01T00:00:00Z",
        "--time-limit", "2", "--workers", "1", "-o", dir.resolve("t.json").toString()));
    return out;
  }

  /** Subcommands that read a scenario (covered by {@link #everyScenarioCommand}) and those that do not. */
  static final List<String> READS_SCENARIO = List.of("inspect", "windows", "plan", "check", "replan", "report");
  // demo reads only the bundled scenario (no user input to reject); campaign and sweep read their own files
  // first, which name a scenario (their errors: CampaignCliTest).
  static final List<String> READS_NO_SCENARIO = List.of("help", "demo", "campaign", "sweep");
}
