package dev.sequencer.slew;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.SlewSettings;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The public entry: settings map to the right model, and bad input names what was wrong. */
class SlewModelTest {

  @Test
  void eigenaxisSettingsGiveTheWorkedExample() {
    // docs/slew.md: 90 deg at 1 deg/s and 0.05 deg/s^2 with 20 s settle is 130 s.
    Transitions t = SlewModel.of(new SlewSettings.Eigenaxis(1.0, 0.05, 20))
        .transitions(List.of(PointingTrack.fixed(new RaDec(0, 0))), PointingTrack.fixed(new RaDec(0, 90)));
    assertEquals(130.0, t.exactS(new int[] {0}, new double[] {0}, new double[] {0})[0], 1e-9);
  }

  @Test
  void altazSettingsKeepTheCableWrap() {
    // Range [-180, 360]: 350 -> 10 must go back 340 deg: 340/3 + 3 + 10 s (see AltAzTest).
    Transitions t = SlewModel.of(new SlewSettings.AltAz(3, 2, 1, 1, 10, List.of(-180.0, 360.0)))
        .transitions(List.of(PointingTrack.parked(new AzElPointing(10, 45))),
            PointingTrack.parked(new AzElPointing(350, 45)));
    assertEquals(340.0 / 3 + 13, t.exactS(new int[] {0}, new double[] {0}, new double[] {0})[0], 1e-9);
  }

  @Test
  void fixedAndMatrixSettingsGiveTheirTables() {
    Transitions fixed = SlewModel.of(new SlewSettings.Fixed(60)).transitions(Arrays.asList(null, null), null);
    assertEquals(60.0, fixed.boundS(0, 1, 0, 10, 20, 30));
    Transitions matrix = SlewModel.of(new SlewSettings.Matrix(List.of(List.of(0.0, 12.0), List.of(13.0, 0.0)),
        List.of(5.0, 9.0))).transitions(Arrays.asList(null, null), null);
    assertEquals(13.0, matrix.boundS(1, 0, 0, 10, 20, 30));
    assertEquals(9.0, matrix.boundS(Transitions.START, 1, 0, 10, 20, 30));
  }

  @Test
  void matrixWithTheWrongNumberOfRowsIsRejected() {
    SlewModel m = SlewModel.matrix(new double[][] {{0, 1}, {1, 0}}, null);
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> m.transitions(Arrays.asList(null, null, null), null));
    assertEquals("slew.seconds: 2 rows, but the scenario has 3 requests", e.getMessage());
  }

  @Test
  void reversedAzimuthRangeIsRejectedInOrder() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> SlewModel.altaz(new SlewSettings.AltAz(3, 2, 1, 1, 10, List.of(270.0, -270.0))));
    assertTrue(e.getMessage().contains("[270.0, -270.0]"), e.getMessage());
  }

  @Test
  void negativeFixedOverheadIsRejected() {
    assertThrows(IllegalArgumentException.class, () -> SlewModel.fixed(-1));
  }
}
