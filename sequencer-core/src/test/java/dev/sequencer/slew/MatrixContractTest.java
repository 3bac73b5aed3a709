package dev.sequencer.slew;

import java.util.Arrays;
import java.util.List;

class MatrixContractTest extends SlewModelContract {
  @Override
  SlewModel model() {
    return SlewModel.matrix(new double[][] {{0, 12, 30}, {12, 0, 7}, {31, 7, 0}}, new double[] {5, 9, 0});
  }

  @Override
  List<PointingTrack> tracks() {
    return Arrays.asList(null, null, null); // the matrix model only counts requests
  }

  @Override
  PointingTrack startTrack() {
    return null;
  }
}
