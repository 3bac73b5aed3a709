package dev.sequencer.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import org.slf4j.LoggerFactory;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParseResult;
import picocli.CommandLine.ScopeType;
import picocli.CommandLine.UnmatchedArgumentException;

/** The {@code sequencer} command line: parses arguments and dispatches to one subcommand. */
@Command(
    name = "sequencer",
    mixinStandardHelpOptions = true,
    versionProvider = Version.class,
    description = {
      "Turns a list of wanted observations into a checked, time-ordered observing plan.",
      ""
    },
    subcommands = {DemoCommand.class, InspectCommand.class, WindowsCommand.class, PlanCommand.class, ReplanCommand.class,
        CampaignCommand.class, SweepCommand.class,
        CheckCommand.class, ReportCommand.class,
        CommandLine.HelpCommand.class},
    footer = {"", Caution.TEXT},
    usageHelpAutoWidth = true)
public final class SequencerCli implements Runnable {
  /** Exit code for invalid input (every problem is printed, one a line). */
  public static final int EXIT_INVALID_INPUT = 2;
  /** Exit code for an internal error (a bug: please report it). */
  public static final int EXIT_INTERNAL = 3;
  /** The slf4j-simple level of our loggers, set by {@code --verbose} before any of them is created. */
  static final String LOG_LEVEL_PROPERTY = "org.slf4j.simpleLogger.log.dev.sequencer";

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Option(names = {"-q", "--quiet"}, scope = ScopeType.INHERIT, description = "Print nothing but warnings (to "
      + "standard error) on success; on failure everything the command printed goes to standard error.")
  boolean quiet;

  @Option(names = "--verbose", scope = ScopeType.INHERIT, description = "Log each phase and its time (reading, "
      + "visibility, planning, checking, writing) to standard error.")
  boolean verbose;

  @Override
  public void run() {
    spec.commandLine().usage(spec.commandLine().getOut());
  }

  /** Runs the command line and returns the exit code (for tests and embedding). */
  public static int execute(PrintWriter out, PrintWriter err, String... args) {
    SequencerCli top = new SequencerCli();
    CommandLine cl = new CommandLine(top);
    cl.setOut(out);
    cl.setErr(err);
    // -V/--version prints the same on every command (picocli's standard option needs a provider on each).
    for (CommandLine sub : cl.getSubcommands().values()) {
      sub.getCommandSpec().versionProvider(new Version());
      if (sub.getCommandSpec().findOption("--version") == null) { // picocli's help command has none
        sub.getCommandSpec().addOption(CommandLine.Model.OptionSpec.builder("-V", "--version").versionHelp(true)
            .description("Print version information and exit.").build());
      }
    }
    cl.setExecutionExceptionHandler(new Failures());
    cl.setParameterExceptionHandler((ex, a) -> {
      PrintWriter e = ex.getCommandLine().getErr();
      e.println(ex instanceof UnmatchedArgumentException u ? unmatched(u) : ex.getMessage());
      e.println("Try '" + ex.getCommandLine().getCommandSpec().qualifiedName() + " --help'.");
      return EXIT_INVALID_INPUT;
    });
    cl.setExecutionStrategy(parsed -> run(top, parsed, out, err));
    int code = cl.execute(args);
    out.flush();
    err.flush();
    return code;
  }

  /** Applies --quiet and --verbose, then runs the chosen command. */
  private static int run(SequencerCli top, ParseResult parsed, PrintWriter out, PrintWriter err) {
    if (top.verbose && System.getProperty(LOG_LEVEL_PROPERTY) == null) {
      // Read by slf4j-simple when each logger is created, i.e. before our classes log for the first time.
      System.setProperty(LOG_LEVEL_PROPERTY, "debug");
    }
    // --help and --version print what was asked for, --quiet or not.
    QuietOutput quietOut = top.quiet && !helpRequested(parsed) ? new QuietOutput() : null;
    if (quietOut != null) {
      parsed.commandSpec().commandLine().setOut(quietOut);
    }
    long t0 = System.nanoTime();
    int code = new CommandLine.RunLast().execute(parsed);
    if (top.verbose) {
      ParseResult last = parsed;
      while (last.hasSubcommand()) {
        last = last.subcommand();
      }
      LoggerFactory.getLogger(SequencerCli.class).debug("{}: exit {} after {} s", last.commandSpec().qualifiedName(),
          code, String.format(Locale.ROOT, "%.2f", (System.nanoTime() - t0) * 1e-9));
    }
    if (quietOut != null) {
      quietOut.finish(code, err);
      parsed.commandSpec().commandLine().setOut(out);
    }
    return code;
  }

  private static boolean helpRequested(ParseResult parsed) {
    for (ParseResult p = parsed; p != null; p = p.hasSubcommand() ? p.subcommand() : null) {
      if (p.isUsageHelpRequested() || p.isVersionHelpRequested() || p.commandSpec().userObject()
          instanceof CommandLine.HelpCommand) {
        return true;
      }
    }
    return false;
  }

  /** An unknown command or option in our words, with picocli's nearest matches as "did you mean". */
  private static String unmatched(UnmatchedArgumentException u) {
    List<String> near = u.getSuggestions().stream().limit(3).toList();
    String arg = u.getUnmatched().isEmpty() ? "" : u.getUnmatched().get(0);
    String cmd = u.getCommandLine().getCommandSpec().qualifiedName();
    String what;
    if (u.isUnknownOption()) {
      what = cmd + ": unknown option '" + arg + "'";
    } else if (!u.getCommandLine().getSubcommands().isEmpty()) {
      what = cmd + ": '" + arg + "' is not a command";
    } else {
      return u.getMessage() + (near.isEmpty() ? "" : " (did you mean " + String.join(" or ", near) + "?)");
    }
    return what + (near.isEmpty() ? "" : " (did you mean " + String.join(" or ", near) + "?)");
  }

  public static void main(String[] args) {
    System.exit(execute(new PrintWriter(System.out, true), new PrintWriter(System.err, true), args));
  }
}
