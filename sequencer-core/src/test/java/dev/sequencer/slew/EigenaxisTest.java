package dev.sequencer.slew;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.RaDec;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;

/** The eigenaxis model: worked example, angle precision, metric properties, interval bounds. */
class EigenaxisTest {
  private static final PointingTrack POLE = PointingTrack.fixed(new RaDec(0, 90));
  private static final PointingTrack EQUATOR_RA0 = PointingTrack.fixed(new RaDec(0, 0));

  @Test
  void ninetyDegreeSlewTakes130Seconds() {
    // Derivation in docs/slew.md: two 20 s ramps cover 20 deg, 70 deg cruise at 1 deg/s, 20 s settle.
    // The pole and the equator are 90 deg apart up to the rounding of cos(90 deg), hence 1e-9.
    Transitions t = SlewModel.eigenaxis(1.0, 0.05, 20).transitions(List.of(EQUATOR_RA0), POLE);
    assertEquals(130.0, t.exactS(new int[] {0}, new double[] {0}, new double[] {200})[0], 1e-9);
    assertEquals(130.0, t.boundS(Transitions.START, 0, 0, 3600, 200, 4000), 1e-6); // fixed tracks: bound = exact
  }

  @Test
  void unchangedPointingTakesNoTimeNotEvenSettle() {
    Transitions t = SlewModel.eigenaxis(1.0, 0.05, 20).transitions(List.of(POLE, POLE), POLE);
    assertEquals(0.0, t.exactS(new int[] {0, 1}, new double[] {0, 100}, new double[] {0, 100})[1]);
    assertEquals(0.0, t.exactS(new int[] {0}, new double[] {0}, new double[] {0})[0]);
  }

  @Test
  void nearlyAlignedVectorsKeepTheirAngle() {
    // 1e-10 rad apart: cos rounds to exactly 1, so acos(dot) would give 0 and the slew would be free.
    double eps = 1e-10;
    Vector3D a = Vector3D.PLUS_I;
    Vector3D b = new Vector3D(Math.cos(eps), Math.sin(eps), 0);
    assertEquals(0.0, Math.acos(Vector3D.dotProduct(a, b)), "the naive formula loses the angle entirely");
    assertEquals(Math.toDegrees(eps), EigenaxisModel.angleDeg(a, b), 1e-6 * Math.toDegrees(eps));
  }

  @Test
  void nearlyOppositeVectorsKeepTheirAngle() {
    double eps = 1e-10;
    Vector3D a = Vector3D.PLUS_I;
    Vector3D b = new Vector3D(-Math.cos(eps), Math.sin(eps), 0);
    assertEquals(180 - Math.toDegrees(eps), EigenaxisModel.angleDeg(a, b), 1e-12);
  }

  @Test
  void reversedDepartureIntervalIsRejected() {
    Transitions t = SlewModel.eigenaxis(1.0, 0.05, 20).transitions(List.of(EQUATOR_RA0), POLE);
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> t.boundS(Transitions.START, 0, 5, 3, 10, 20));
    assertTrue(e.getMessage().contains("[5.0, 3.0]"), e.getMessage());
  }

  @Test
  void invalidLimitsAreRejectedWithTheirName() {
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> SlewModel.eigenaxis(1.0, 0, 20));
    assertTrue(e.getMessage().startsWith("accelDegPerS2"), e.getMessage());
  }

  @Provide
  Arbitrary<Vector3D> directions() {
    Arbitrary<Double> c = Arbitraries.doubles().between(-1, 1).ofScale(6);
    return Combinators.combine(c, c, c).as(Vector3D::new).filter(v -> v.getNorm() > 1e-3).map(Vector3D::normalize);
  }

  @Provide
  Arbitrary<EigenaxisModel> models() {
    return Combinators.combine(
            Arbitraries.doubles().between(0.05, 5), Arbitraries.doubles().between(0.005, 2).ofScale(4),
            Arbitraries.of(0.0, 5.0, 20.0))
        .as(EigenaxisModel::new);
  }

  /**
   * The sequencer may drop requests from a route (a skipped request is a self-loop). That only keeps
   * the remaining route feasible and no longer if going a -> c directly is never slower than a -> b -> c,
   * and lower bounds on route length rely on it too. With settle, an unchanged pointing costs 0, so the
   * inequality holds with settle as well (two moves pay two settles).
   */
  @Property(tries = 500)
  void triangleInequalityWithAndWithoutSettle(@ForAll("directions") Vector3D a, @ForAll("directions") Vector3D b,
      @ForAll("directions") Vector3D c, @ForAll("models") EigenaxisModel m) {
    EigenaxisModel noSettle = new EigenaxisModel(m.profile().rateDegPerS(), m.profile().accelDegPerS2(), 0);
    for (EigenaxisModel model : List.of(noSettle, m)) {
      // 1e-9 s: angles come from three separate atan2 calls, each exact to ~1e-14 deg.
      assertTrue(model.seconds(a, c) <= model.seconds(a, b) + model.seconds(b, c) + 1e-9);
    }
  }

  @Property(tries = 300)
  void symmetricAndNonNegative(@ForAll("directions") Vector3D a, @ForAll("directions") Vector3D b,
      @ForAll("models") EigenaxisModel m) {
    assertTrue(m.seconds(a, b) >= 0);
    assertEquals(m.seconds(a, b), m.seconds(b, a), 1e-9);
  }

  @Property(tries = 300)
  void nonDecreasingWithTheAngle(@ForAll @DoubleRange(min = 0, max = 180) double x,
      @ForAll @DoubleRange(min = 0, max = 180) double y, @ForAll("models") EigenaxisModel m) {
    assertTrue(m.secondsForAngle(Math.min(x, y)) <= m.secondsForAngle(Math.max(x, y)));
  }

  /**
   * Moving lines of sight: the bound over departure and arrival intervals covers the exact leg at 21
   * departures times 5 arrivals inside them.
   */
  @Property(tries = 300)
  void boundNeverBelowExactForMovingTargets(@ForAll("directions") Vector3D a, @ForAll("directions") Vector3D b,
      @ForAll("directions") Vector3D towards, @ForAll @DoubleRange(min = 0, max = 0.8) double rateTo,
      @ForAll @DoubleRange(min = 0, max = 0.8) double rateFrom,
      @ForAll @DoubleRange(min = 0, max = 5000) double departureMinS,
      @ForAll @DoubleRange(min = 0, max = 600) double widthS,
      @ForAll @DoubleRange(min = 0, max = 600) double arrivalWidthS, @ForAll("models") EigenaxisModel m) {
    PointingTrack from = MovingTrack.inertial(a, towards, rateFrom);
    PointingTrack to = MovingTrack.inertial(b, towards, rateTo);
    Transitions t = m.transitions(List.of(from, to), from);
    double a0 = departureMinS + widthS + 30;
    double a1 = a0 + arrivalWidthS;
    double bound = t.boundS(0, 1, departureMinS, departureMinS + widthS, a0, a1);
    double startBound = t.boundS(Transitions.START, 1, departureMinS, departureMinS + widthS, a0, a1);
    for (int s = 0; s <= 20; s++) {
      double departure = departureMinS + widthS * s / 20;
      for (int r = 0; r <= 4; r++) {
        double arrival = a0 + arrivalWidthS * r / 4;
        double exact = t.exactS(new int[] {1}, new double[] {departure}, new double[] {arrival})[0];
        assertTrue(exact <= bound, () -> "exact " + exact + " > bound " + bound + " at " + departure);
        assertTrue(exact <= startBound, () -> "exact " + exact + " > start bound " + startBound);
        double pair = t.exactS(new int[] {0, 1}, new double[] {0, departure}, new double[] {0, arrival})[1];
        assertTrue(pair <= bound, () -> "exact " + pair + " > bound " + bound + " at " + departure);
      }
    }
  }

  @Test
  void boundIsWithinAFewSecondsOverFiveMinutesForSlowTargets() {
    // 0.004 deg/s (about the sidereal rate) on both sides over 300 s departure and arrival intervals: the
    // lines of sight move up to 1.2 deg each, about 2.4 s of cruise at 1 deg/s, which is the bound's slack
    // at most. Checked against the worst of 61 x 13 sampled departures and arrivals.
    PointingTrack from = MovingTrack.inertial(Vector3D.PLUS_I, Vector3D.PLUS_J, 0.004);
    PointingTrack to = MovingTrack.inertial(Vector3D.PLUS_K, Vector3D.PLUS_J, 0.004);
    Transitions t = SlewModel.eigenaxis(1.0, 0.05, 20).transitions(List.of(from, to), from);
    double bound = t.boundS(0, 1, 1000, 1300, 1400, 1700);
    double worst = 0;
    for (int s = 0; s <= 60; s++) {
      for (int r = 0; r <= 12; r++) {
        worst = Math.max(worst, t.exactS(new int[] {1}, new double[] {1000 + 5 * s}, new double[] {1400 + 25 * r})[0]);
      }
    }
    assertTrue(bound >= worst);
    assertTrue(bound - worst <= 3.0, "slack " + (bound - worst) + " s");
  }
}
