// Newton–Raphson on the MNA equations, with the safeguards of the circuit-simulation literature
// (Nagel 1975, SPICE2; Vladimirescu, "The SPICE Book", 1994): junction limiting (in the device
// models), gmin in parallel with junctions, gmin stepping with a shunt on every node, source
// stepping, and convergence on both the step (voltages and branch currents) and the KCL residual.
import { nodeV, type Device, type ResidualSink, type Stamper } from './device';
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
export const UNKNOWN_BRANCH = 1;

export interface NewtonOutcome {
  converged: boolean;
  x: Float64Array;
  /** the iterate before x (for reporting what was still moving) */
  prev: Float64Array;
  iterations: number;
  singular?: number[];
  nonFinite?: boolean;
}

export interface NewtonRun {
  gmin: number;
  sourceScale: number;
  /** conductance from every node to ground (gmin stepping), S */
  shunt: number;
  maxIterations: number;
}

/** The assembled circuit the Newton loop works on. */
export class MnaCircuit {
  readonly nonlinear: boolean;
  private readonly residualSum: Float64Array;
  private readonly residualMax: Float64Array;

  constructor(
    readonly size: number,
    /** UNKNOWN_NODE or UNKNOWN_BRANCH per unknown */
    readonly kinds: Uint8Array,
    readonly devices: Device[],
    readonly system: LinearSystem,
    readonly tol: NewtonTolerances,
  ) {
    this.nonlinear = devices.some((d) => d.nonlinear);
    this.residualSum = new Float64Array(size);
    this.residualMax = new Float64Array(size);
  }

  private stamper(run: NewtonRun, flag: { limited: boolean }): Stamper {
    const sys = this.system;
    return {
      gmin: run.gmin,
      sourceScale: run.sourceScale,
      markLimited() {
        flag.limited = true;
      },
      conductance(a, b, g) {
        if (a >= 0) sys.add(a, a, g);
        if (b >= 0) sys.add(b, b, g);
        if (a >= 0 && b >= 0) {
          sys.add(a, b, -g);
          sys.add(b, a, -g);
        }
      },
      add(r, c, v) {
        if (r >= 0 && c >= 0) sys.add(r, c, v);
      },
      addRhs(r, v) {
        if (r >= 0) sys.addRhs(r, v);
      },
      current(a, b, i) {
        if (a >= 0) sys.addRhs(a, -i);
        if (b >= 0) sys.addRhs(b, i);
      },
      nonlinear(nodes, currents, controls, jac) {
        for (let k = 0; k < nodes.length; k++) {
          const n = nodes[k];
          if (n < 0) continue;
          let eq = currents[k];
          const row = jac[k];
          for (let m = 0; m < controls.length; m++) {
            const [p, q, v] = controls[m];
            const g = row[m];
            if (p >= 0) sys.add(n, p, g);
            if (q >= 0) sys.add(n, q, -g);
            eq -= g * v;
          }
          sys.addRhs(n, -eq);
        }
      },
    };
  }

  /** Largest KCL residual relative to its tolerance (≤ 1 means converged) at x. */
  residualRatio(x: Float64Array, run: NewtonRun): { ratio: number; node: number } {
    const r = this.residualSum;
    const m = this.residualMax;
    r.fill(0);
    m.fill(0);
    const sink: ResidualSink = {
      add(node, i) {
        if (node < 0) return;
        r[node] += i;
        const a = Math.abs(i);
        if (a > m[node]) m[node] = a;
      },
    };
    for (const d of this.devices) d.residual(x, sink, run.gmin, run.sourceScale);
    let worst = 0;
    let node = -1;
    for (let i = 0; i < this.size; i++) {
      if (this.kinds[i] !== UNKNOWN_NODE) continue;
      let ri = r[i];
      if (run.shunt > 0) ri += run.shunt * x[i];
      const t = this.tol.reltol * m[i] + this.tol.abstol;
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
      d.begin?.(x);
      d.load(st, x);
    }
    for (let i = 0; i < n; i++) if (this.kinds[i] === UNKNOWN_NODE) rec(i, i);
    return out;
  }

  newton(x0: Float64Array, run: NewtonRun): NewtonOutcome {
    let x: Float64Array = x0.slice();
    let prev: Float64Array = x0.slice();
    for (const d of this.devices) d.begin?.(x);
    const flag = { limited: false };
    const st = this.stamper(run, flag);
    const { reltol, vntol, abstol } = this.tol;
    for (let it = 1; it <= run.maxIterations; it++) {
      this.system.clear();
      flag.limited = false;
      for (const d of this.devices) d.load(st, x);
      if (run.shunt > 0) for (let i = 0; i < this.size; i++) if (this.kinds[i] === UNKNOWN_NODE) this.system.add(i, i, run.shunt);
      const sol = this.system.solve();
      if (!(sol instanceof Float64Array)) return { converged: false, x, prev, iterations: it, singular: sol.unknowns };
      let finite = true;
      for (let i = 0; i < sol.length; i++)
        if (!Number.isFinite(sol[i])) {
          finite = false;
          break;
        }
      if (!finite) return { converged: false, x, prev, iterations: it, nonFinite: true };
      if (!this.nonlinear) return { converged: true, x: sol, prev: x, iterations: it };
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
      if (stepOk && !flag.limited && this.residualRatio(x, run).ratio <= 1) return { converged: true, x, prev, iterations: it };
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
