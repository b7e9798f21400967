// Newton–Raphson on the MNA equations, with the safeguards of the circuit-simulation literature
// (L. W. Nagel, UCB/ERL memorandum M520, 1975; from memory): junction limiting (in the device
// models), gmin in parallel with junctions, gmin stepping with a shunt on every node, source
// stepping, and convergence on both the step (voltages and branch currents) and the KCL residual.
import { nodeV, type Device, type ResidualSink, type Stamper, type StartKind } from './device';
import type { LinearSystem } from './linear/types';

export interface NewtonTolerances {
  /** relative tolerance on steps and residuals */
  reltol: number;
  /** absolute voltage tolerance, V */
  vntol: number;
  /** absolute current tolerance, A */
  abstol: number;
}

export const UNKNOWN_NODE = 0;
/** KCL residuals within this many ulps of a node's current scale count as zero (see `noise`). */
const ROUNDING_ULPS = 16;
/** a direct solve is refined when a row's residual exceeds this many ulps of its scale */
const REFINE_ULPS = 8;
export const UNKNOWN_BRANCH = 1;

export interface NewtonOutcome {
  converged: boolean;
  x: Float64Array;
  /** the iterate before x (for reporting what was still moving) */
  prev: Float64Array;
  iterations: number;
  singular?: number[];
  /** unknowns whose new value came out NaN or infinite (the iteration was abandoned) */
  nonFinite?: number[];
}

export interface NewtonRun {
  gmin: number;
  sourceScale: number;
  /** conductance from every node to ground (gmin stepping), S */
  shunt: number;
  maxIterations: number;
  /** from all-zero x, let constant-power loads draw from the first iteration (see StartKind) */
  loadsOnAtStart?: boolean;
}

/**
 * Writes device stamps into a linear system, every entry (and rhs entry) scaled by its row's
 * scale (see MnaCircuit.rowScale), recording each row's largest unscaled entry. A class rather
 * than an object of closures: several are made per solve, and a Monte Carlo run makes 10⁵ solves.
 */
class ScaledStamper implements Stamper {
  constructor(
    private readonly sys: Pick<LinearSystem, 'add' | 'addRhs'>,
    private readonly rowScale: Float64Array,
    private readonly rowMax: Float64Array,
    readonly gmin: number,
    readonly sourceScale: number,
    private readonly flag: { limited: boolean },
  ) {}
  private put(r: number, c: number, v: number): void {
    this.sys.add(r, c, v * this.rowScale[r]);
    const a = Math.abs(v);
    if (a > this.rowMax[r]) this.rowMax[r] = a;
  }
  private putRhs(r: number, v: number): void {
    this.sys.addRhs(r, v * this.rowScale[r]);
  }
  markLimited(): void {
    this.flag.limited = true;
  }
  conductance(a: number, b: number, g: number): void {
    if (a >= 0) this.put(a, a, g);
    if (b >= 0) this.put(b, b, g);
    if (a >= 0 && b >= 0) {
      this.put(a, b, -g);
      this.put(b, a, -g);
    }
  }
  add(r: number, c: number, v: number): void {
    if (r >= 0 && c >= 0) this.put(r, c, v);
  }
  addRhs(r: number, v: number): void {
    if (r >= 0) this.putRhs(r, v);
  }
  current(a: number, b: number, i: number): void {
    if (a >= 0) this.putRhs(a, -i);
    if (b >= 0) this.putRhs(b, i);
  }
  nonlinear(nodes: readonly number[], currents: readonly number[], controls: ReadonlyArray<readonly [number, number, number]>, jac: ReadonlyArray<readonly number[]>): void {
    for (let k = 0; k < nodes.length; k++) {
      const n = nodes[k];
      if (n < 0) continue;
      let eq = currents[k];
      const row = jac[k];
      for (let m = 0; m < controls.length; m++) {
        const [p, q, v] = controls[m];
        const g = row[m];
        if (p >= 0) this.put(n, p, g);
        if (q >= 0) this.put(n, q, -g);
        eq -= g * v;
      }
      this.putRhs(n, -eq);
    }
  }
}

/** The assembled circuit the Newton loop works on. */
export class MnaCircuit {
  readonly nonlinear: boolean;
  /** some device starts open from a cold start (see StartKind): a 'cold-loads-on' retry may help */
  readonly hasPowerUpStart: boolean;
  private readonly residualSum: Float64Array;
  private readonly residualMax: Float64Array;
  /**
   * Per node, the scale of the rounding in its currents at the point of the last residual: Σ over
   * the devices of |g|·(|v_a| + |v_b|) (ResidualSink.add's third argument). A node's KCL residual
   * cannot be driven below a few ulps of it, however exact the solution (a 1 µΩ resistor at
   * 1000 V: 1e6 S·1000 V·2.2e-16 ≈ 2e-7 A).
   */
  private readonly noise: Float64Array;
  /**
   * Row equilibration: each equation is multiplied by a power of two near 1/(its largest entry in
   * the previous iteration), which changes no unknown and is exact. Without it a junction forced far
   * into its exponential by an ideal source (g ≈ 1e16 S beside the source's 1) leaves a pivot of
   * 1/g, which the linear solvers' relative test takes for a singular matrix (hard case 06).
   */
  private readonly rowScale: Float64Array;
  /** largest |entry| per row in the current load, for the next iteration's rowScale */
  private readonly rowMax: Float64Array;
  private scaleReady = false;

  /** Forget the row scales: the next Newton run measures them afresh (call at the start of a solve). */
  resetScaling(): void {
    this.rowScale.fill(1);
    this.scaleReady = false;
  }

  /**
   * Largest current (A) that the junction gmin carries into any node at x, and the largest device
   * current into any node: a gmin solution is only an answer when the first is negligible.
   */
  gminShare(x: Float64Array, gmin: number): { gminAmps: number; scaleAmps: number } {
    const a = new Float64Array(this.size);
    const b = new Float64Array(this.size);
    let scale = 0;
    const sa: ResidualSink = { add: (n, i) => { if (n >= 0) { a[n] += i; scale = Math.max(scale, Math.abs(i)); } } };
    const sb: ResidualSink = { add: (n, i) => { if (n >= 0) b[n] += i; } };
    for (const d of this.devices) {
      d.residual(x, sa, 0, 1);
      d.residual(x, sb, gmin, 1);
    }
    let g = 0;
    for (let i = 0; i < this.size; i++) if (this.kinds[i] === UNKNOWN_NODE) g = Math.max(g, Math.abs(b[i] - a[i]));
    return { gminAmps: g, scaleAmps: scale };
  }

  constructor(
    readonly size: number,
    /** UNKNOWN_NODE or UNKNOWN_BRANCH per unknown */
    readonly kinds: Uint8Array,
    readonly devices: Device[],
    readonly system: LinearSystem,
    readonly tol: NewtonTolerances,
  ) {
    this.nonlinear = devices.some((d) => d.nonlinear);
    this.hasPowerUpStart = devices.some((d) => d.startsOpen === true);
    this.residualSum = new Float64Array(size);
    this.residualMax = new Float64Array(size);
    this.noise = new Float64Array(size);
    this.rowScale = new Float64Array(size).fill(1);
    this.rowMax = new Float64Array(size);
  }

  /** Scales for the next iteration from this iteration's row maxima (powers of two: exact). */
  private updateRowScale(): void {
    for (let i = 0; i < this.size; i++) {
      const m = this.rowMax[i];
      // within 2^±400: a row holding 1e308 Ω beside unit entries must not scale them into denormals
      this.rowScale[i] = m > 0 && Number.isFinite(m) ? Math.pow(2, Math.max(-400, Math.min(400, -Math.round(Math.log2(m))))) : 1;
    }
  }

  /**
   * The stamps of `devices` at x, unscaled, as matrix entries and right-hand side: A·x − b is then
   * their KCL and branch residual F(x), and A the Jacobian ∂F/∂x (the companion model is the
   * linearisation at x). Devices must have begun from x ('warm'), so no junction is limited.
   */
  stampsAt(devices: readonly Device[], x: Float64Array, gmin: number, sink: Pick<LinearSystem, 'add' | 'addRhs'>): void {
    const run: NewtonRun = { gmin, sourceScale: 1, shunt: 0, maxIterations: 1 };
    const st = this.stamper(run, { limited: false }, sink, false);
    for (const d of devices) d.load(st, x);
  }

  private stamper(run: NewtonRun, flag: { limited: boolean }, sys: Pick<LinearSystem, 'add' | 'addRhs'> = this.system, scaled = true): Stamper {
    return new ScaledStamper(sys, scaled ? this.rowScale : new Float64Array(this.size).fill(1), this.rowMax, run.gmin, run.sourceScale, flag);
  }

  /** Largest KCL residual relative to its tolerance (≤ 1 means converged) at x. */
  residualRatio(x: Float64Array, run: NewtonRun): { ratio: number; node: number } {
    const r = this.residualSum;
    const m = this.residualMax;
    const noise = this.noise;
    r.fill(0);
    m.fill(0);
    noise.fill(0);
    const sink: ResidualSink = {
      add(node, i, scale) {
        if (node < 0) return;
        r[node] += i;
        const a = Math.abs(i);
        if (a > m[node]) m[node] = a;
        noise[node] += scale ?? a;
      },
    };
    for (const d of this.devices) d.residual(x, sink, run.gmin, run.sourceScale);
    let worst = 0;
    let node = -1;
    for (let i = 0; i < this.size; i++) {
      if (this.kinds[i] !== UNKNOWN_NODE) continue;
      let ri = r[i];
      if (run.shunt > 0) ri += run.shunt * x[i];
      const t = this.tol.reltol * m[i] + this.tol.abstol + ROUNDING_ULPS * Number.EPSILON * this.noise[i];
      const q = Math.abs(ri) / t;
      if (!(q <= worst)) {
        worst = q;
        node = i;
      }
    }
    return { ratio: worst, node };
  }

  /** Record the matrix pattern (every position a device will ever stamp). */
  pattern(): Array<[number, number]> {
    const seen = new Set<number>();
    const out: Array<[number, number]> = [];
    const n = this.size;
    const rec = (r: number, c: number) => {
      if (r < 0 || c < 0) return;
      const k = r * n + c;
      if (!seen.has(k)) {
        seen.add(k);
        out.push([r, c]);
      }
    };
    const st: Stamper = {
      gmin: 0,
      sourceScale: 1,
      markLimited() {},
      conductance(a, b) {
        rec(a, a);
        rec(b, b);
        rec(a, b);
        rec(b, a);
      },
      add: rec,
      addRhs() {},
      current() {},
      nonlinear(nodes, _c, controls) {
        for (const nd of nodes) for (const [p, q] of controls) {
          rec(nd, p);
          rec(nd, q);
        }
      },
    };
    const x = new Float64Array(n);
    for (const d of this.devices) {
      d.begin?.(x, 'cold');
      d.load(st, x);
    }
    for (let i = 0; i < n; i++) if (this.kinds[i] === UNKNOWN_NODE) rec(i, i);
    return out;
  }

  /**
   * Iterative refinement of a direct solve in working precision (R. D. Skeel, "Iterative refinement
   * implies numerical stability for Gaussian elimination", Math. Comp. 35, 1980): when a row's
   * residual b − A·x is above a few ulps of Σ|a||x| + |b| — a partial-pivoting LU is only normwise
   * stable, and a sheet with a 1e6 A loop beside nanoampere branches shows it — solve A·δ = r once
   * or twice more. A nonlinear solve needs none: each Newton step re-evaluates the residual.
   */
  private refineLinear(x: Float64Array, run: NewtonRun): Float64Array {
    return this.refine(x, run, (_i, r, scale) => Math.abs(r) > REFINE_ULPS * Number.EPSILON * scale);
  }

  /**
   * At a converged Newton point: the convergence test looks at KCL rows only, so a branch
   * equation (a source's v(pos) − v(neg) − R·i = V, a 0 Ω link) may still be off by the LU's
   * normwise rounding, beside 1e9 A elsewhere by 1e-7 V. Refine when one is off by more than
   * reltol·(its terms) + vntol; the refinement step is a Newton step in correction form.
   */
  private refineBranches(x: Float64Array, run: NewtonRun): Float64Array {
    const { reltol, vntol } = this.tol;
    return this.refine(x, run, (i, r, scale) => this.kinds[i] === UNKNOWN_BRANCH && Math.abs(r) > (reltol * scale + vntol) * this.rowScale[i]);
  }

  private refine(x: Float64Array, run: NewtonRun, needs: (row: number, residual: number, scale: number) => boolean): Float64Array {
    const n = this.size;
    for (let pass = 0; pass < 2; pass++) {
      const r = new Float64Array(n);
      const scale = new Float64Array(n);
      const flag = { limited: false };
      const measure = this.stamper(run, flag, {
        add(row, col, v) {
          r[row] -= v * x[col];
          scale[row] += Math.abs(v * x[col]);
        },
        addRhs(row, v) {
          r[row] += v;
          scale[row] += Math.abs(v);
        },
      });
      for (const d of this.devices) d.load(measure, x);
      if (run.shunt > 0)
        for (let i = 0; i < n; i++)
          if (this.kinds[i] === UNKNOWN_NODE) {
            r[i] -= run.shunt * this.rowScale[i] * x[i];
            scale[i] += Math.abs(run.shunt * this.rowScale[i] * x[i]);
          }
      let any = false;
      for (let i = 0; i < n && !any; i++) any = needs(i, r[i], scale[i]);
      if (!any) break;
      this.system.clear();
      const matrixOnly = this.stamper(run, flag, { add: (row, col, v) => this.system.add(row, col, v), addRhs() {} });
      for (const d of this.devices) d.load(matrixOnly, x);
      if (run.shunt > 0) for (let i = 0; i < n; i++) if (this.kinds[i] === UNKNOWN_NODE) this.system.add(i, i, run.shunt * this.rowScale[i]);
      for (let i = 0; i < n; i++) this.system.addRhs(i, r[i]);
      const d = this.system.solve();
      if (!(d instanceof Float64Array) || !d.every(Number.isFinite)) break;
      const next = new Float64Array(n);
      for (let i = 0; i < n; i++) next[i] = x[i] + d[i];
      x = next;
    }
    return x;
  }

  newton(x0: Float64Array, run: NewtonRun): NewtonOutcome {
    let x: Float64Array = x0.slice();
    let prev: Float64Array = x0.slice();
    // one scan for all devices (a per-device scan would cost devices × unknowns)
    const start: StartKind = x.every((v) => v === 0) ? (run.loadsOnAtStart ? 'cold-loads-on' : 'cold') : 'warm';
    const flag = { limited: false };
    if (!this.scaleReady && this.nonlinear) {
      // a load that only records row sizes, so even the first iteration is equilibrated
      const dry = this.stamper(run, flag, { add() {}, addRhs() {} });
      this.rowMax.fill(0);
      for (const d of this.devices) {
        d.begin?.(x, start);
        d.load(dry, x);
      }
      this.updateRowScale();
      this.scaleReady = true;
    }
    for (const d of this.devices) d.begin?.(x, start);
    const st = this.stamper(run, flag);
    const { reltol, vntol, abstol } = this.tol;
    for (let it = 1; it <= run.maxIterations; it++) {
      this.system.clear();
      flag.limited = false;
      this.rowMax.fill(0);
      for (const d of this.devices) d.load(st, x);
      if (run.shunt > 0) for (let i = 0; i < this.size; i++) if (this.kinds[i] === UNKNOWN_NODE) this.system.add(i, i, run.shunt * this.rowScale[i]);
      if (this.nonlinear) this.updateRowScale();
      const sol = this.system.solve();
      if (!(sol instanceof Float64Array)) return { converged: false, x, prev, iterations: it, singular: sol.unknowns };
      let bad: number[] | null = null;
      for (let i = 0; i < sol.length; i++) if (!Number.isFinite(sol[i])) (bad ??= []).push(i);
      if (bad) return { converged: false, x, prev, iterations: it, nonFinite: bad };
      if (!this.nonlinear) return { converged: true, x: this.refineLinear(sol, run), prev: x, iterations: it };
      let stepOk = true;
      for (let i = 0; i < this.size; i++) {
        const a = sol[i];
        const b = x[i];
        const lim = reltol * Math.max(Math.abs(a), Math.abs(b)) + (this.kinds[i] === UNKNOWN_NODE ? vntol : abstol);
        if (!(Math.abs(a - b) <= lim)) {
          stepOk = false;
          break;
        }
      }
      prev = x;
      x = sol;
      if (stepOk && !flag.limited && this.residualRatio(x, run).ratio <= 1) return { converged: true, x: this.refineBranches(x, run), prev, iterations: it };
    }
    return { converged: false, x, prev, iterations: run.maxIterations };
  }
}

/** For messages: how much each device's nodes moved between two iterates. */
export function deviceMovement(devices: Device[], x: Float64Array, prev: Float64Array): Array<{ partId: string; change: number }> {
  const out: Array<{ partId: string; change: number }> = [];
  for (const d of devices) {
    let m = 0;
    for (const n of d.nodes) m = Math.max(m, Math.abs(nodeV(x, n) - nodeV(prev, n)));
    out.push({ partId: d.partId, change: m });
  }
  return out;
}
