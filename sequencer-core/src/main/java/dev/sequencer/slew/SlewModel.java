package dev.sequencer.slew;

import dev.sequencer.model.SlewSettings;
import java.util.List;

/**
 * A slew-time model; it turns the pointing tracks of a scenario's requests into the {@link Transitions}
 * the sequencer and validator use. Models are immutable and may be shared between threads.
 *
 * <p>Without a start track, the first leg of a sequence takes 0 s (the instrument is taken to be on the
 * first target already). See docs/slew.md for each model's formula and the derivation of its bounds.
 */
public interface SlewModel {

  /**
   * Transitions between {@code tracks} (one per request, in file order) and from {@code startTrackOrNull}.
   * The {@code fixed} and {@code matrix} models only use the list's size; its elements may then be null.
   */
  Transitions transitions(List<PointingTrack> tracks, PointingTrack startTrackOrNull);

  /**
   * As {@link #transitions(List, PointingTrack)}, with the cones every slew keeps out of (spec A3). The
   * eigenaxis model detours around them ({@link Detour}); the other models ignore them (alt-az Sun
   * keep-outs are not modelled yet; fixed and matrix have no path).
   */
  default Transitions transitions(List<PointingTrack> tracks, PointingTrack startTrackOrNull, KeepOuts keepOuts) {
    return transitions(tracks, startTrackOrNull);
  }

  /**
   * Rest-to-rest rotation about the eigenaxis between inertial lines of sight: bang-coast-bang limited by
   * {@code rateDegPerS} and {@code accelDegPerS2} (bang-bang when short), plus {@code settleS}; 0 s when
   * the line of sight is unchanged. Example: 1 deg/s, 0.05 deg/s², 20 s settle, 90° → 130 s.
   */
  static SlewModel eigenaxis(double rateDegPerS, double accelDegPerS2, double settleS) {
    return new EigenaxisModel(rateDegPerS, accelDegPerS2, settleS);
  }

  /** A two-axis alt-az mount as configured, with elevation limits [0°, 90°]. */
  static SlewModel altaz(SlewSettings.AltAz settings) {
    return altaz(settings, 0, 90);
  }

  /**
   * A two-axis alt-az mount: the slower axis plus settle, the azimuth unwrapped inside
   * {@code settings.azimuthRangeDeg()} (the quicker legal way round), and pointings outside
   * [{@code elevationMinDeg}, {@code elevationMaxDeg}] unreachable.
   */
  static SlewModel altaz(SlewSettings.AltAz settings, double elevationMinDeg, double elevationMaxDeg) {
    return new AltAzModel(settings, elevationMinDeg, elevationMaxDeg);
  }

  /** The same {@code seconds} between any two requests and from the start pointing. */
  static SlewModel fixed(double seconds) {
    Transitions.fixed(0, seconds); // validates now rather than at first use
    return (tracks, start) -> Transitions.fixed(tracks.size(), seconds);
  }

  /**
   * A user table by request order: {@code seconds[i][j]} from request i to j and {@code fromStartSeconds[j]}
   * from the start pointing (all zero when {@code null}). The track list must have one entry per row.
   */
  static SlewModel matrix(double[][] seconds, double[] fromStartSeconds) {
    Transitions table = Transitions.matrix(seconds, fromStartSeconds);
    return (tracks, start) -> {
      if (tracks.size() != table.size()) {
        throw new IllegalArgumentException(
            "slew.seconds: " + table.size() + " rows, but the scenario has " + tracks.size() + " requests");
      }
      return table;
    };
  }

  /** The model a scenario's {@code slew} object names; alt-az mounts get elevation limits [0°, 90°]. */
  static SlewModel of(SlewSettings settings) {
    if (settings instanceof SlewSettings.Eigenaxis e) {
      return eigenaxis(e.rateDegPerS(), e.accelDegPerS2(), e.settleS());
    } else if (settings instanceof SlewSettings.AltAz a) {
      return altaz(a);
    } else if (settings instanceof SlewSettings.Fixed f) {
      return fixed(f.seconds());
    } else if (settings instanceof SlewSettings.Matrix m) {
      double[][] table = m.seconds().stream()
          .map(row -> row.stream().mapToDouble(Double::doubleValue).toArray())
          .toArray(double[][]::new);
      double[] fromStart = m.fromStartSeconds() == null ? null
          : m.fromStartSeconds().stream().mapToDouble(Double::doubleValue).toArray();
      return matrix(table, fromStart);
    }
    throw new IllegalStateException("unknown slew settings " + settings);
  }
}
