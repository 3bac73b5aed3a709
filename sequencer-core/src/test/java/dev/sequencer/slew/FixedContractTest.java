package dev.sequencer.slew;

import java.util.Arrays;
import java.util.List;

class FixedContractTest extends SlewModelContract {
  @Override
  SlewModel model() {
    return SlewModel.fixed(60);
  }

  @Override
  List<PointingTrack> tracks() {
    return Arrays.asList(null, null, null); // the fixed model only counts requests
  }

  @Override
  PointingTrack startTrack() {
    return null;
  }
}
