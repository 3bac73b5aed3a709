package dev.sequencer.cli;

import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The {@code sequencer} command line: parses arguments and dispatches to one subcommand. */
@Command(
    name = "sequencer",
    mixinStandardHelpOptions = true,
    version = "sequencer 0.1.0",
    description = {
      "Turns a list of wanted observations into a checked, time-ordered observing plan.",
      ""
    },
    subcommands = {DemoCommand.class, InspectCommand.class, WindowsCommand.class, PlanCommand.class, ReplanCommand.class,
        CheckCommand.class,
        CommandLine.HelpCommand.class},
    footer = {"", Caution.TEXT},
    usageHelpAutoWidth = true)
public final class SequencerCli implements Runnable {
  /** Exit code for invalid input (every problem is printed, one a line). */
  public static final int EXIT_INVALID_INPUT = 2;
  /** Exit code for an internal error (a bug: please report it). */
  public static final int EXIT_INTERNAL = 3;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    spec.commandLine().usage(spec.commandLine().getOut());
  }

  /** Runs the command line and returns the exit code (for tests and embedding). */
  public static int execute(PrintWriter out, PrintWriter err, String... args) {
    CommandLine cl = new CommandLine(new SequencerCli());
    cl.setOut(out);
    cl.setErr(err);
    cl.setExecutionExceptionHandler(new Failures());
    cl.setParameterExceptionHandler((ex, a) -> {
      ex.getCommandLine().getErr().println(ex.getMessage());
      ex.getCommandLine().getErr().println("Try '" + ex.getCommandLine().getCommandSpec().qualifiedName() + " --help'.");
      return EXIT_INVALID_INPUT;
    });
    int code = cl.execute(args);
    out.flush();
    err.flush();
    return code;
  }

  public static void main(String[] args) {
    System.exit(execute(new PrintWriter(System.out, true), new PrintWriter(System.err, true), args));
  }
}
