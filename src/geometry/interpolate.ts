/**
 * Cubic Hermite interpolation of a target's ECEF state between nodes spaced
 * `nodeStepS` apart (position and velocity at both nodes), for dense sampling
 * inside contacts: two propagations per node interval instead of one per sample.
 * Error bound of cubic Hermite on [0, h]: |r''''| h^4 / 384 (standard
 * interpolation theory), so the error grows as h^4. Measured against direct SGP4 on
 * the demo's 500-1,200 km orbits over a day: 0.07 m at h = 30 s, 0.37 m at 60 s,
 * 5.8 m at 120 s (velocity 0.035 m/s at 60 s). 60 s is used: far below SGP4's own
 * ~1 km. test/geometry/interpolate.test.ts checks < 2 m. Units: ms, s, km, km/s.
 */
import type { Target } from './types.js';

/** Node spacing of the link-sampling interpolator, s. */
export const INTERPOLATION_NODE_STEP_S = 60;

/**
 * Geocentric distances of the nodes a StateInterpolator propagated, per target: index k for
 * the node at originMs + k stepMs, |r| of the target's own stateEcefAt there (Math.hypot of
 * its position), for plan/margin.ts maxGeocentricRadiusKm, whose samples are the same times.
 * Only states that were found are kept (a node without a state is not).
 */
interface NodeRadii {
  originMs: number;
  stepMs: number;
  radiusKm: Float64Array;
  known: Uint8Array;
}

const nodeRadii = new WeakMap<Target, NodeRadii>();

/** The target's node distances for this origin and step (new ones replace others). */
function nodeRadiiFor(target: Target, originMs: number, stepMs: number): NodeRadii {
  let m = nodeRadii.get(target);
  if (!m || m.originMs !== originMs || m.stepMs !== stepMs) {
    m = { originMs, stepMs, radiusKm: new Float64Array(0), known: new Uint8Array(0) };
    nodeRadii.set(target, m);
  }
  return m;
}

function recordNodeRadius(m: NodeRadii, k: number, state: Float64Array): void {
  if (!(k >= 0) || k > 1e7) return;
  if (k >= m.known.length) {
    const n = Math.max(k + 1, 2 * m.known.length, 1024);
    const r = new Float64Array(n);
    r.set(m.radiusKm);
    const known = new Uint8Array(n);
    known.set(m.known);
    m.radiusKm = r;
    m.known = known;
  }
  m.radiusKm[k] = Math.hypot(state[0]!, state[1]!, state[2]!);
  m.known[k] = 1;
}

/**
 * Math.hypot of target.stateEcefAt(tMs)'s position when a StateInterpolator with this origin
 * and node step found that state at a node (tMs = originMs + k stepMs), else undefined. The
 * same number the call would give (a state is a function of its time), so it is offered only
 * while the target has met no propagation failure (failedAtMs: then a call may answer
 * otherwise than it did).
 */
export function knownNodeRadiusKm(target: Target, originMs: number, stepMs: number, tMs: number): number | undefined {
  if (target.failedAtMs !== undefined) return undefined;
  const m = nodeRadii.get(target);
  if (!m || m.originMs !== originMs || m.stepMs !== stepMs) return undefined;
  const k = (tMs - originMs) / stepMs;
  if (!Number.isInteger(k) || k < 0 || k >= m.known.length || m.known[k] !== 1) return undefined;
  return m.radiusKm[k];
}

export class StateInterpolator {
  private readonly stepMs: number;
  private node = Number.NaN;
  private okA = false;
  private okB = false;
  private readonly a = new Float64Array(6);
  private readonly b = new Float64Array(6);
  /** Propagations made for nodes. */
  propagations = 0;
  /** Where the nodes' distances are kept (knownNodeRadiusKm), found on the first node. */
  private radii: NodeRadii | undefined = undefined;

  constructor(
    private readonly target: Target,
    private readonly originMs: number,
    nodeStepS: number = INTERPOLATION_NODE_STEP_S,
  ) {
    this.stepMs = nodeStepS * 1000;
  }

  /** Writes the interpolated ECEF state at tMs into out[0..5]; false when a node has no state. */
  stateAt(tMs: number, out: Float64Array): boolean {
    const k = Math.floor((tMs - this.originMs) / this.stepMs);
    if (k !== this.node) {
      const t0 = this.originMs + k * this.stepMs;
      if (k === this.node + 1 && this.okB) {
        this.a.set(this.b);
        this.okA = true;
      } else {
        this.okA = this.target.stateEcefAt(t0, this.a);
        this.propagations++;
        if (this.okA) recordNodeRadius((this.radii ??= nodeRadiiFor(this.target, this.originMs, this.stepMs)), k, this.a);
      }
      this.okB = this.target.stateEcefAt(t0 + this.stepMs, this.b);
      this.propagations++;
      if (this.okB) recordNodeRadius((this.radii ??= nodeRadiiFor(this.target, this.originMs, this.stepMs)), k + 1, this.b);
      this.node = k;
    }
    if (!this.okA || !this.okB) return this.target.stateEcefAt(tMs, out);
    const h = this.stepMs / 1000;
    const s = (tMs - (this.originMs + k * this.stepMs)) / this.stepMs;
    const s2 = s * s;
    const s3 = s2 * s;
    const h00 = 2 * s3 - 3 * s2 + 1;
    const h10 = s3 - 2 * s2 + s;
    const h01 = -2 * s3 + 3 * s2;
    const h11 = s3 - s2;
    // derivatives with respect to s, divided by h for d/dt
    const d00 = (6 * s2 - 6 * s) / h;
    const d10 = 3 * s2 - 4 * s + 1;
    const d01 = (-6 * s2 + 6 * s) / h;
    const d11 = 3 * s2 - 2 * s;
    const a = this.a;
    const b = this.b;
    for (let i = 0; i < 3; i++) {
      const pa = a[i]!;
      const va = a[i + 3]!;
      const pb = b[i]!;
      const vb = b[i + 3]!;
      out[i] = h00 * pa + h10 * h * va + h01 * pb + h11 * h * vb;
      out[i + 3] = d00 * pa + d10 * va + d01 * pb + d11 * vb;
    }
    return true;
  }
}

/**
 * Cubic Hermite state between packed nodes k and k+1 of `nodes` ([x y z vx vy vz] per node,
 * spaced hS seconds), at fraction s of the interval: position into out[o..o+2], velocity
 * into out[o+3..o+5]. Allocation-free (hot path of the tabulated Moon).
 */
export function hermitePackedState(nodes: Float64Array, k: number, s: number, hS: number, out: Float64Array | number[], o: number): void {
  const s2 = s * s;
  const s3 = s2 * s;
  const h00 = 2 * s3 - 3 * s2 + 1;
  const h10 = (s3 - 2 * s2 + s) * hS;
  const h01 = -2 * s3 + 3 * s2;
  const h11 = (s3 - s2) * hS;
  const d00 = (6 * s2 - 6 * s) / hS;
  const d10 = 3 * s2 - 4 * s + 1;
  const d01 = (-6 * s2 + 6 * s) / hS;
  const d11 = 3 * s2 - 2 * s;
  const a = 6 * k;
  const b = a + 6;
  for (let i = 0; i < 3; i++) {
    const p0 = nodes[a + i]!;
    const v0 = nodes[a + 3 + i]!;
    const p1 = nodes[b + i]!;
    const v1 = nodes[b + 3 + i]!;
    out[o + i] = h00 * p0 + h10 * v0 + h01 * p1 + h11 * v1;
    out[o + 3 + i] = d00 * p0 + d10 * v0 + d01 * p1 + d11 * v1;
  }
}
