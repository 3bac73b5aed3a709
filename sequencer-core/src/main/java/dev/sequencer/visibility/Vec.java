package dev.sequencer.visibility;

/** Small allocation-free 3-vector helpers on {@code double[]} slices (x, y, z at offset). */
final class Vec {
  private Vec() {}

  static double dot(double[] a, double[] b) {
    return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  }

  static double norm(double[] a) {
    return Math.sqrt(dot(a, a));
  }

  /** a - b into out. */
  static void sub(double[] a, double[] b, double[] out) {
    out[0] = a[0] - b[0];
    out[1] = a[1] - b[1];
    out[2] = a[2] - b[2];
  }

  /** Normalises a in place; returns the former norm. */
  static double normalize(double[] a) {
    double n = norm(a);
    a[0] /= n;
    a[1] /= n;
    a[2] /= n;
    return n;
  }

  /**
   * Angle between two vectors in radians, robust for nearly aligned or opposite vectors
   * (atan2 of |a x b| and a . b rather than acos of the dot product).
   */
  static double angle(double[] a, double[] b) {
    double cx = a[1] * b[2] - a[2] * b[1];
    double cy = a[2] * b[0] - a[0] * b[2];
    double cz = a[0] * b[1] - a[1] * b[0];
    return Math.atan2(Math.sqrt(cx * cx + cy * cy + cz * cz), dot(a, b));
  }

  /** out = x * ax + y * ay + z * az (a vector given in a rotated basis). */
  static void combine(double x, double[] ax, double y, double[] ay, double z, double[] az, double[] out) {
    out[0] = x * ax[0] + y * ay[0] + z * az[0];
    out[1] = x * ax[1] + y * ay[1] + z * az[1];
    out[2] = x * ax[2] + y * ay[2] + z * az[2];
  }
}
