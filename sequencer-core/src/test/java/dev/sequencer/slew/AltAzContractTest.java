package dev.sequencer.slew;

import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.SlewSettings;
import java.util.List;

class AltAzContractTest extends SlewModelContract {
  @Override
  SlewModel model() {
    return SlewModel.altaz(new SlewSettings.AltAz(3, 2, 1, 1, 10, List.of(-270.0, 270.0)), 5, 89);
  }

  @Override
  List<PointingTrack> tracks() {
    // Stars above 5 deg for the whole probe (latitude 40 N) and a slow object crossing azimuth 0.
    return List.of(
        new StarTrack(40, 10, 0, -20),
        new StarTrack(40, 70, 0, 150),
        MovingTrack.ground(340, 0.01, 2, 40, 5, 0.01));
  }

  @Override
  PointingTrack startTrack() {
    return PointingTrack.parked(new AzElPointing(-200, 60));
  }
}
