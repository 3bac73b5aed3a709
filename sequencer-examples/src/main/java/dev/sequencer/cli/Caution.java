package dev.sequencer.cli;

/** The safety caution printed in every command's help. */
final class Caution {
  private Caution() {}

  static final String TEXT =
      "CAUTION: plans are advisory. Pointing an instrument near the Sun or commanding a real slew can "
          + "damage hardware. Check every plan with your own flight-rule and safety checks before use; "
          + "local rules and licensed practice take precedence over this tool.";
}
