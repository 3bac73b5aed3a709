package dev.sequencer.campaign;

import dev.sequencer.model.Campaign;
import dev.sequencer.model.TimeWindow;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.SplittableRandom;

/**
 * The weather of one night, drawn from the campaign's seeded model: the cloud blocks (sorted by start) and
 * the observation attempts that fail. Depends only on (seed, night index, the night's window), never on the
 * strategy or on what was planned, so every strategy meets the same sky; an attempt's failure depends on
 * (seed, night, request id, attempt number) only.
 */
public record NightWeather(long seed, int night, List<TimeWindow> clouds, double failureFraction) {
  public NightWeather {
    clouds = List.copyOf(clouds);
  }

  /** A clear night with no failures. */
  public static NightWeather clear(int night) {
    return new NightWeather(0, night, List.of(), 0);
  }

  /** Draws night {@code night} (0-based) of the season in {@code window}. */
  public static NightWeather draw(Campaign.Weather w, int night, TimeWindow window) {
    SplittableRandom r = new SplittableRandom(mix(w.seed(), night, 0x5eed));
    List<TimeWindow> clouds = new ArrayList<>();
    boolean clear = r.nextDouble() < w.clearNightProbability();
    if (!clear && w.cloudBlocksMax() > 0) {
      int blocks = 1 + r.nextInt(w.cloudBlocksMax());
      long nightS = (long) window.durationS();
      for (int k = 0; k < blocks; k++) {
        long len = Math.round(w.cloudBlockMinS() + r.nextDouble() * (w.cloudBlockMaxS() - w.cloudBlockMinS()));
        len = Math.min(len, nightS);
        long start = (long) (r.nextDouble() * (nightS - len));
        clouds.add(new TimeWindow(window.start().plusSeconds(start), window.start().plusSeconds(start + len)));
      }
      clouds.sort(Comparator.comparing(TimeWindow::start));
    }
    return new NightWeather(w.seed(), night, clouds, w.failureFraction());
  }

  /** True when the night has no cloud. */
  public boolean isClear() {
    return clouds.isEmpty();
  }

  /** Seconds of cloud (overlaps counted once). */
  public double cloudS() {
    double total = 0;
    Instant reach = null;
    for (TimeWindow c : clouds) {
      Instant a = reach != null && reach.isAfter(c.start()) ? reach : c.start();
      if (c.end().isAfter(a)) {
        total += new TimeWindow(a, c.end()).durationS();
        reach = c.end();
      }
    }
    return total;
  }

  /** The first cloud (by start) that overlaps [start, end), or null. */
  public TimeWindow cloudOver(Instant start, Instant end) {
    for (TimeWindow c : clouds) {
      if (start.isBefore(c.end()) && c.start().isBefore(end)) {
        return c;
      }
    }
    return null;
  }

  /** True when attempt {@code attempt} (0-based, within the night) of request {@code id} fails. */
  public boolean fails(String id, int attempt) {
    if (failureFraction <= 0) {
      return false;
    }
    long h = mix(seed, night, attempt);
    for (byte b : id.getBytes(StandardCharsets.UTF_8)) {
      h = mix(h, b, 31);
    }
    return new SplittableRandom(h).nextDouble() < failureFraction;
  }

  private static long mix(long a, long b, long c) {
    long h = a * 0x9E3779B97F4A7C15L + b;
    h = (h ^ (h >>> 31)) * 0xBF58476D1CE4E5B9L + c;
    return h ^ (h >>> 29);
  }
}
