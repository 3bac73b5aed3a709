package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.sequence.cpsat.NativeSolver;
import org.junit.jupiter.api.Test;

/** The native library loads once; a failed load becomes one clear, repeated message. */
class NativeSolverTest {
  @Test
  void loadsOnThisMachine() {
    NativeSolver.ensureLoaded();
    NativeSolver.ensureLoaded(); // a second call is a no-op
  }

  @Test
  void anUnsupportedPlatformIsNamedWithTheSupportedOnes() {
    NativeSolver.resetForTests();
    try {
      int[] calls = {0};
      Runnable failing = () -> {
        calls[0]++;
        throw new UnsatisfiedLinkError("no jniortools in java.library.path");
      };
      NativeSolver.Unavailable first = assertThrows(NativeSolver.Unavailable.class, () -> NativeSolver.load(failing));
      NativeSolver.Unavailable again = assertThrows(NativeSolver.Unavailable.class, () -> NativeSolver.load(failing));
      assertSame(first, again);
      assertTrue(calls[0] == 1, "the loader ran " + calls[0] + " times");
      String m = first.getMessage();
      assertTrue(m.contains("os.name \"" + System.getProperty("os.name") + "\""), m);
      assertTrue(m.contains("os.arch \"" + System.getProperty("os.arch") + "\""), m);
      assertTrue(m.contains("linux-x86-64") && m.contains("darwin-aarch64"), m);
      assertTrue(m.contains("no jniortools in java.library.path"), m);
    } finally {
      NativeSolver.resetForTests();
      NativeSolver.ensureLoaded();
    }
  }
}
