package dev.sequencer.sequence.cpsat;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.planner.FuzzScenarios;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.slew.Transitions;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The bucket-pair cost of an arc out of a flexible request covers every exposure it may take: for starts of
 * {@code from} in a bucket and every exposure from the shortest to the longest, the exact leg (the slew
 * model's {@code exactS}, which the validator re-derives independently) to any arrival in the other bucket
 * is at most the cost. The scenarios: an alt-az ground night (the mount follows the sky, so a later departure
 * changes the leg) and a LEO telescope with the Earth-limb keep-out during slews. A cost built from the
 * shortest exposure alone (the rule before 2026-12-03, when flexible exposures with such slews were refused
 * at input) fails on the alt-az night: F0 leaving at 8414 s for F1, exact leg 75.4 s against a cost of 71 s.
 * The exact legs are the planner's own slew code (not an outside check); the property is the bound's.
 */
class TimeBucketsFlexibleTest {
  @ParameterizedTest(name = "{0} seed {1}")
  @CsvSource({"GROUND_FIELDS_ALTAZ, 9", "LEO_TLE_FIELDS, 6"})
  void bucketCostsOutOfAFlexibleRequestCoverItsLongestExposure(FuzzScenarios.Kind kind, long seed) {
    AstroContext ctx = AstroContext.offline();
    PlanningProblem p = Planner.prepare(FuzzScenarios.generate(kind, seed, ctx), ctx).problem();
    Transitions tr = p.transitions();
    assertTrue(tr.timeDependent(), "the slews depend on time");
    TimeBuckets buckets = new TimeBuckets(p);
    int checked = 0;
    int impossible = 0;
    int infinite = 0;
    double worstShare = 0;
    for (int i = 0; i < p.size(); i++) {
      Task a = p.task(i);
      if (!a.flexible() || !a.schedulable()) {
        continue;
      }
      for (int j = 0; j < p.size(); j++) {
        Task b = p.task(j);
        if (j == i || !b.schedulable()) {
          continue;
        }
        for (long fromLo = a.earliestStartS(); fromLo <= a.latestStartS(); fromLo += 300) {
          long fromHi = Math.min(a.latestStartS(), fromLo + 60);
          long toLo = Math.max(b.earliestStartS(), fromLo + a.durationS());
          long toHi = Math.min(b.latestStartS(), fromHi + a.maxDurationS() + 240);
          if (toHi < toLo) {
            continue;
          }
          long c = buckets.cost(i, fromLo, fromHi, j, toLo, toHi);
          if (c < 0) {
            impossible++;
            continue;
          }
          for (int k = 0; k <= 6; k++) {
            long start = fromLo + (fromHi - fromLo) * k / 6;
            long depart = start + a.maxDurationS() - (a.maxDurationS() - a.durationS()) * (k % 3) / 2;
            for (long arrive = Math.max(toLo, depart); arrive <= toHi; arrive += 60) {
              double leg = tr.exactS(new int[] {i, j}, new double[] {0, depart}, new double[] {start, arrive})[1];
              infinite += leg < Double.POSITIVE_INFINITY ? 0 : 1;
              if (leg < Double.POSITIVE_INFINITY) {
                checked++;
                worstShare = Math.max(worstShare, leg / Math.max(1, c));
                assertTrue(leg <= c + 1e-6, a.id() + " started " + start + ", leaving " + depart + " for " + b.id()
                    + " at " + arrive + ": exact leg " + leg + " s above the bucket cost " + c + " s");
              }
            }
          }
        }
      }
    }
    assertTrue(checked > 300, "only " + checked + " legs checked; impossible buckets " + impossible + ", infinite legs "
        + infinite);
  }
}
