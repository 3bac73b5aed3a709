package dev.sequencer.io;

import java.util.Collection;
import java.util.Locale;

/** "Did you mean ...?" for misspelt names, by case-insensitive edit distance. */
final class Suggest {
  private Suggest() {}

  /**
   * The closest of {@code candidates} to {@code name}, or {@code null} when none is close: a candidate
   * qualifies when at most a third of its letters (at least one) must change.
   */
  static String closest(String name, Collection<String> candidates) {
    String best = null;
    int bestDistance = Integer.MAX_VALUE;
    for (String c : candidates) {
      int d = distance(name.toLowerCase(Locale.ROOT), c.toLowerCase(Locale.ROOT));
      if (d <= Math.max(1, c.length() / 3) && d < bestDistance) {
        best = c;
        bestDistance = d;
      }
    }
    return best;
  }

  /** " (did you mean X?)" or the empty string. */
  static String hint(String name, Collection<String> candidates) {
    String c = closest(name, candidates);
    return c == null ? "" : " (did you mean " + c + "?)";
  }

  /** Levenshtein distance: insertions, deletions and substitutions each cost 1. */
  static int distance(String a, String b) {
    int[] prev = new int[b.length() + 1];
    int[] cur = new int[b.length() + 1];
    for (int j = 0; j <= b.length(); j++) {
      prev[j] = j;
    }
    for (int i = 1; i <= a.length(); i++) {
      cur[0] = i;
      for (int j = 1; j <= b.length(); j++) {
        int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
        cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
      }
      int[] t = prev;
      prev = cur;
      cur = t;
    }
    return prev[b.length()];
  }
}
