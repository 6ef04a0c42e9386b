/**
 * One-dimensional solvers for the contact search: a bracketed root (AOS/LOS) and a
 * bracketed maximum (peak elevation).
 *
 * Methods: Brent's root finder (inverse quadratic interpolation, secant and bisection
 * safeguard) and Brent's parabolic/golden-section minimiser, R. P. Brent, "Algorithms
 * for Minimization without Derivatives" (1973), chapters 4 and 5; code shape after
 * Press et al., "Numerical Recipes", 3rd ed. (2007), sections 9.3 and 10.3.
 * Both take an iteration limit and throw when it is exceeded (a bug: a continuous
 * function on a finite bracket must converge).
 * Units: whatever the caller's abscissa is (the search uses seconds from a bracket start).
 */

const EPS = 2.220446049250313e-16;
const CGOLD = 0.3819660112501051;

/** Thrown when a solver exceeds its iteration limit: a bug, never user input. */
export class SolverLimitError extends Error {
  constructor(what: string, maxIterations: number, lo: number, hi: number) {
    super(`${what} did not converge in ${maxIterations} iterations on [${lo}, ${hi}]`);
    this.name = 'SolverLimitError';
  }
}

/**
 * Boundary between f > 0 and f <= 0 inside [a, b], where exactly one of fa = f(a),
 * fb = f(b) is > 0. Returns the end of the final bracket on the f > 0 side, so the
 * result x has f(x) > 0 and lies within `tol` of the boundary.
 */
export function brentBoundary(
  f: (x: number) => number,
  a: number,
  fa: number,
  b: number,
  fb: number,
  tol: number,
  maxIterations: number,
): number {
  if (fa > 0 === fb > 0) throw new Error(`brentBoundary: [${a}, ${b}] does not bracket a crossing (${fa}, ${fb})`);
  const lo = a;
  const hi = b;
  let c = b;
  let fc = fb;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIterations; iter++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * EPS * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1) return fb > 0 ? b : c;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < Math.min(min1, min2)) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm >= 0 ? tol1 : -tol1;
    fb = f(b);
  }
  throw new SolverLimitError('brentBoundary', maxIterations, lo, hi);
}

/** Result holder of brentMax (reused; no allocation per call). */
export interface MaxResult {
  x: number;
  f: number;
}

/**
 * Maximum of f on [a, b] starting from an interior point x0 with value f0 (the best
 * sample). Local: it finds the maximum of a unimodal f; `out.x` is within ~tol of it.
 */
export function brentMax(
  f: (x: number) => number,
  a: number,
  b: number,
  x0: number,
  f0: number,
  tol: number,
  maxIterations: number,
  out: MaxResult,
): MaxResult {
  const lo = a;
  const hi = b;
  let x = x0;
  let w = x0;
  let v = x0;
  let fx = -f0;
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  const tol1 = 0.5 * tol + 1e-12;
  const tol2 = 2 * tol1;
  for (let iter = 0; iter < maxIterations; iter++) {
    const xm = 0.5 * (a + b);
    if (Math.abs(x - xm) <= tol2 - 0.5 * (b - a)) {
      out.x = x;
      out.f = -fx;
      return out;
    }
    if (Math.abs(e) > tol1) {
      const r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      q = Math.abs(q);
      const etemp = e;
      e = d;
      if (Math.abs(p) >= Math.abs(0.5 * q * etemp) || p <= q * (a - x) || p >= q * (b - x)) {
        e = x >= xm ? a - x : b - x;
        d = CGOLD * e;
      } else {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = xm - x >= 0 ? tol1 : -tol1;
      }
    } else {
      e = x >= xm ? a - x : b - x;
      d = CGOLD * e;
    }
    const u = Math.abs(d) >= tol1 ? x + d : x + (d >= 0 ? tol1 : -tol1);
    const fu = -f(u);
    if (fu <= fx) {
      if (u >= x) a = x;
      else b = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  throw new SolverLimitError('brentMax', maxIterations, lo, hi);
}
