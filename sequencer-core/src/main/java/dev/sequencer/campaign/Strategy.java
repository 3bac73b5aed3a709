package dev.sequencer.campaign;

import dev.sequencer.sequence.SequencerOptions;
import java.util.Arrays;
import java.util.Locale;

/**
 * How a night is planned and executed. {@link #CPSAT}: the optimiser plans the night at dusk and re-plans
 * the rest after each loss. {@link #GREEDY} and {@link #BEST_NOW} dispatch: after every observation (done
 * or lost) the greedy picks the next one from the current state, by best priority per second used
 * (waiting + slew + exposure) or by the highest priority among what can start soonest.
 */
public enum Strategy {
  CPSAT("cpsat", SequencerOptions.Solver.CPSAT, false),
  GREEDY("greedy", SequencerOptions.Solver.GREEDY, true),
  BEST_NOW("best-now", SequencerOptions.Solver.BEST_NOW, true);

  private final String label;
  private final SequencerOptions.Solver solver;
  private final boolean dispatch;

  Strategy(String label, SequencerOptions.Solver solver, boolean dispatch) {
    this.label = label;
    this.solver = solver;
    this.dispatch = dispatch;
  }

  /** The name in files and on the command line. */
  public String label() {
    return label;
  }

  /** The sequencer's solver for this strategy's plans. */
  public SequencerOptions.Solver solver() {
    return solver;
  }

  /** True when the strategy decides one observation at a time. */
  public boolean dispatch() {
    return dispatch;
  }

  /** The strategy of this label; {@link IllegalArgumentException} naming the allowed ones otherwise. */
  public static Strategy of(String label) {
    String l = label.trim().toLowerCase(Locale.ROOT);
    for (Strategy s : values()) {
      if (s.label.equals(l)) {
        return s;
      }
    }
    throw new IllegalArgumentException("must be one of " + String.join(", ",
        Arrays.stream(values()).map(Strategy::label).toList()) + " (was " + label + ")");
  }
}
