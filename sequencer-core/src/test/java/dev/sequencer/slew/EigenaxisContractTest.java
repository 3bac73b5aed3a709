package dev.sequencer.slew;

import dev.sequencer.model.RaDec;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;

class EigenaxisContractTest extends SlewModelContract {
  @Override
  SlewModel model() {
    return SlewModel.eigenaxis(1.0, 0.05, 20);
  }

  @Override
  List<PointingTrack> tracks() {
    return List.of(
        PointingTrack.fixed(new RaDec(10, -20)),
        MovingTrack.inertial(new Vector3D(1, 2, 3), new Vector3D(-1, 0, 1), 0.05),
        MovingTrack.inertial(new Vector3D(0, -1, 0.2), Vector3D.PLUS_K, 0.5));
  }

  @Override
  PointingTrack startTrack() {
    return PointingTrack.fixed(new RaDec(0, 90));
  }
}
