/**
 * Polynomial interpolation of tabulated states, as a CCSDS OEM header asks for it
 * (CCSDS 502.0-B-3 sec. 5.2.3, INTERPOLATION / INTERPOLATION_DEGREE).
 *
 * - Lagrange of degree d: the d + 1 nodes around t (centred, shifted at the ends), each
 *   of the six components interpolated on its own (barycentric-free product form).
 * - Hermite of degree d: m = ceil((d + 1) / 2) nodes around t with positions and
 *   velocities (2m conditions: degree 2m - 1), Newton divided differences on doubled
 *   nodes; the velocity is the derivative of the position polynomial.
 *   Source: R. L. Burden, J. D. Faires, "Numerical Analysis", 9th ed., sec. 3.4
 *   (Hermite interpolation, Algorithm 3.3).
 * Accuracy (test/geometry/interpolate-poly.test.ts): a 550 km LEO sampled every 60 s,
 * degree 7, is reproduced between nodes to a few mm (Lagrange) / mm (Hermite).
 * Allocation-free after construction. Units: s relative to a node, km, km/s.
 */

/** Most nodes a window may use (Lagrange degree 15). */
const MAX_NODES = 16;

export class PolyInterpolator {
  private readonly x = new Float64Array(2 * MAX_NODES);
  private readonly q = new Float64Array(2 * MAX_NODES);
  private last = 0;

  /**
   * @param tMs node epochs (ascending), states 6 per node (km, km/s)
   */
  constructor(
    private readonly tMs: Float64Array,
    private readonly states: Float64Array,
    private readonly hermite: boolean,
    degree: number,
  ) {
    const want = hermite ? Math.ceil((degree + 1) / 2) : degree + 1;
    this.nodes = Math.max(2, Math.min(want, tMs.length, MAX_NODES));
  }

  private readonly nodes: number;

  /** Index of the first node of the window around tMs. */
  private windowStart(t: number): number {
    const ts = this.tMs;
    const n = ts.length;
    let j = this.last;
    if (!(ts[j]! <= t && (j + 1 >= n || t < ts[j + 1]!))) {
      let lo = 0;
      let hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (ts[mid]! <= t) lo = mid;
        else hi = mid;
      }
      j = lo;
      this.last = j;
    }
    const k0 = j - ((this.nodes - 1) >> 1);
    return Math.max(0, Math.min(k0, n - this.nodes));
  }

  /** Writes the state at tMs into out[0..5]. */
  stateAt(t: number, out: Float64Array): void {
    const k0 = this.windowStart(t);
    if (this.hermite) this.hermiteAt(k0, t, out);
    else this.lagrangeAt(k0, t, out);
  }

  private lagrangeAt(k0: number, t: number, out: Float64Array): void {
    const m = this.nodes;
    const ts = this.tMs;
    const s = this.states;
    const ref = ts[k0]!;
    const u = (t - ref) / 1000;
    for (let c = 0; c < 6; c++) out[c] = 0;
    for (let i = 0; i < m; i++) {
      const xi = (ts[k0 + i]! - ref) / 1000;
      let w = 1;
      for (let j = 0; j < m; j++) {
        if (j === i) continue;
        const xj = (ts[k0 + j]! - ref) / 1000;
        w *= (u - xj) / (xi - xj);
      }
      const b = 6 * (k0 + i);
      for (let c = 0; c < 6; c++) out[c]! += w * s[b + c]!;
    }
  }

  private hermiteAt(k0: number, t: number, out: Float64Array): void {
    const m = this.nodes;
    const n2 = 2 * m;
    const ts = this.tMs;
    const s = this.states;
    const ref = ts[k0]!;
    const u = (t - ref) / 1000;
    const x = this.x;
    const q = this.q;
    for (let i = 0; i < m; i++) {
      const xi = (ts[k0 + i]! - ref) / 1000;
      x[2 * i] = xi;
      x[2 * i + 1] = xi;
    }
    for (let c = 0; c < 3; c++) {
      // divided differences in place: q[j] becomes f[x0..xj]
      for (let i = 0; i < m; i++) {
        const v = s[6 * (k0 + i) + c]!;
        q[2 * i] = v;
        q[2 * i + 1] = v;
      }
      for (let level = 1; level < n2; level++) {
        for (let j = n2 - 1; j >= level; j--) {
          const dx = x[j]! - x[j - level]!;
          if (level === 1 && dx === 0) q[j] = s[6 * (k0 + (j >> 1)) + 3 + c]!;
          else q[j] = (q[j]! - q[j - 1]!) / dx;
        }
      }
      // Newton form and its derivative by Horner
      let p = q[n2 - 1]!;
      let dp = 0;
      for (let j = n2 - 2; j >= 0; j--) {
        dp = dp * (u - x[j]!) + p;
        p = p * (u - x[j]!) + q[j]!;
      }
      out[c] = p;
      out[c + 3] = dp;
    }
  }
}
