package dev.sequencer.visibility;

/**
 * A 3-vector sampled on a regular grid {@code t0S + k * stepS}, k = 0..n-1, interpolated by 4-point
 * Lagrange (cubic) polynomials.
 *
 * <p>Why cubic Lagrange: the error is about h^4 f''''/128; for a LEO position sampled every 30 s
 * (f'''' ~ n^4 r ~ 1e-5 m/s^4) that is well under a metre, i.e. below 0.1 arcsec of pointing, and for
 * the slowly turning Earth axes it is below 1e-12. No derivatives are needed.
 */
final class SampledVectors {
  final double t0S;
  final double stepS;
  final int n;
  final double[] xyz;

  SampledVectors(double t0S, double stepS, int n) {
    this.t0S = t0S;
    this.stepS = stepS;
    this.n = n;
    this.xyz = new double[3 * n];
  }

  void set(int k, double x, double y, double z) {
    xyz[3 * k] = x;
    xyz[3 * k + 1] = y;
    xyz[3 * k + 2] = z;
  }

  void get(int k, double[] out) {
    out[0] = xyz[3 * k];
    out[1] = xyz[3 * k + 1];
    out[2] = xyz[3 * k + 2];
  }

  /** Interpolated value at {@code tS} (seconds from the horizon start) into {@code out}. */
  void at(double tS, double[] out) {
    double u = (tS - t0S) / stepS;
    int k = (int) Math.floor(u);
    if (u == k && k >= 0 && k < n) {
      get(k, out);
      return;
    }
    if (n < 4) {
      linear(u, out);
      return;
    }
    int k0 = Math.max(0, Math.min(n - 4, k - 1));
    double x = u - k0;
    // Lagrange basis on nodes 0, 1, 2, 3.
    double l0 = -(x - 1) * (x - 2) * (x - 3) / 6.0;
    double l1 = x * (x - 2) * (x - 3) / 2.0;
    double l2 = -x * (x - 1) * (x - 3) / 2.0;
    double l3 = x * (x - 1) * (x - 2) / 6.0;
    for (int c = 0; c < 3; c++) {
      int b = 3 * k0 + c;
      out[c] = l0 * xyz[b] + l1 * xyz[b + 3] + l2 * xyz[b + 6] + l3 * xyz[b + 9];
    }
  }

  private void linear(double u, double[] out) {
    int k = Math.max(0, Math.min(n - 2, (int) Math.floor(u)));
    double f = u - k;
    for (int c = 0; c < 3; c++) {
      out[c] = (1 - f) * xyz[3 * k + c] + f * xyz[3 * k + 3 + c];
    }
  }
}
