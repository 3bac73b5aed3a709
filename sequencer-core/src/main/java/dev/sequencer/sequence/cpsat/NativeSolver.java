package dev.sequencer.sequence.cpsat;


import com.google.ortools.Loader;
import java.util.List;
import java.util.Locale;

/**
 * Loads OR-Tools' native library (CP-SAT and GLOP) once per JVM, from the jar, before any solver object
 * is built. On a platform OR-Tools ships no native library for, every call fails the same way with an
 * {@link Unavailable} that names {@code os.name}/{@code os.arch} and the supported platforms, instead of
 * an {@link UnsatisfiedLinkError} deep inside the first solve. Thread-safe.
 */
public final class NativeSolver {
  /** Platforms the OR-Tools Java artifacts bundle a native library for (OR-Tools 9.x). */
  public static final List<String> SUPPORTED =
      List.of("linux-x86-64", "linux-aarch64", "darwin-x86-64", "darwin-aarch64", "win32-x86-64");

  /** The native solver cannot run on this machine; the message says why and what is supported. */
  public static final class Unavailable extends IllegalStateException {
    private static final long serialVersionUID = 1L;

    public Unavailable(String message, Throwable cause) {
      super(message, cause);
    }
  }

  private static final Object LOCK = new Object();
  private static boolean loaded;
  private static Unavailable failure;

  private NativeSolver() {}

  /** Loads the library on the first call; later calls return at once or rethrow the first failure. */
  public static void ensureLoaded() {
    load(Loader::loadNativeLibraries);
  }

  /** {@link #ensureLoaded} with the loading step given (tests replace it to simulate a failure). */
  public static void load(Runnable loader) {
    synchronized (LOCK) {
      if (loaded) {
        return;
      }
      if (failure != null) {
        throw failure;
      }
      try {
        loader.run();
        loaded = true;
      } catch (UnsatisfiedLinkError | RuntimeException e) {
        failure = unavailable(e, System.getProperty("os.name"), System.getProperty("os.arch"));
        throw failure;
      }
    }
  }

  /** The exception for a failed load on this platform, with the cause's own message. */
  public static Unavailable unavailable(Throwable cause, String osName, String osArch) {
    return new Unavailable(String.format(Locale.ROOT,
        "the OR-Tools native solver could not be loaded on this platform (os.name \"%s\", os.arch \"%s\"): %s. "
            + "Supported platforms: %s. Use --solver greedy, which needs no native library.",
        osName, osArch, cause.getMessage() == null ? cause.getClass().getSimpleName() : cause.getMessage(),
        String.join(", ", SUPPORTED)), cause);
  }

  /** Forgets the outcome of the last load (tests only). */
  public static void resetForTests() {
    synchronized (LOCK) {
      loaded = false;
      failure = null;
    }
  }
}
