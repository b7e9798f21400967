// Adjoint sensitivities of one output to many parameters at a converged operating point: one
// transposed solve Jᵀ·λ = ∂y/∂x gives dy/dp = ∂y/∂p − λᵀ·∂F/∂p for every p (S. W. Director and
// R. A. Rohrer, "The generalized adjoint network and network sensitivities", IEEE Trans. Circuit
// Theory 16(3), 1969). F is the MNA residual A(x)·x − b(x), J = ∂F/∂x its Jacobian, recorded from
// the device stamps at x. ∂F/∂p and ∂y/∂p come from the part's own stamp at x with the param moved
// by ±h (a central difference of one device, no re-solve).
import { nodeV, type Device } from './device';
import { createLinearSystem, type LinearSolverKind, type LinearSystemFactory } from './linear/index';
import type { MnaCircuit } from './newton';

/** What to differentiate: a net voltage (V), the current into a pin (A), or a part's power (W). */
export type SensitivityOutput = { kind: 'net'; net: string } | { kind: 'current'; part: string; pin: string } | { kind: 'power'; part: string };

export interface ParamRef {
  part: string;
  param: string;
}

export interface SensitivityEntry {
  part: string;
  param: string;
  /** the param's value in the solve (its unit) */
  value: number;
  /** dy/dp, in output unit per param unit; null when moving the param changes the circuit's structure (reason says how) */
  derivative: number | null;
  /** (p/y)·dy/dp, dimensionless; null when y or p is 0 */
  normalized: number | null;
  reason?: string;
}

export interface SensitivityReport {
  /** the output's value at the operating point */
  output: number;
  entries: SensitivityEntry[];
}

/** What the compiled circuit hands over: its last solution and a way to re-create one device. */
export interface SensitivityContext {
  circuit: MnaCircuit;
  x: Float64Array;
  gmin: number;
  linearSolver: LinearSolverKind | LinearSystemFactory;
  /** unknown of a net (−1 for ground), undefined when there is no such net */
  netUnknown(net: string): number | undefined;
  /** the part's device and the unknowns of its pins (−1 for ground) */
  device(part: string): { device: Device; pins: readonly number[]; pinNames: readonly string[] } | undefined;
  /** the part's device with one param changed, or a reason it cannot be (structure changes, invalid value) */
  perturbed(part: string, param: string, value: number): Device | string;
  paramValue(part: string, param: string): number | undefined;
}

/** Relative step of the one-device central difference: truncation (h²) and rounding (ε/h) both near 1e-10. */
const REL_STEP = 1e-5;

type Vec = Map<number, number>;

/** A·x − b of one device at x (its contribution to every row). */
function residualOf(ctx: SensitivityContext, d: Device): Vec {
  d.begin?.(ctx.x, 'warm');
  const f: Vec = new Map();
  const bump = (r: number, v: number) => f.set(r, (f.get(r) ?? 0) + v);
  ctx.circuit.stampsAt([d], ctx.x, ctx.gmin, { add: (r, c, v) => bump(r, v * ctx.x[c]), addRhs: (r, v) => bump(r, -v) });
  return f;
}

/** The output's value and its gradient ∂y/∂x (sparse), with a device swapped in when given. */
function outputAt(ctx: SensitivityContext, out: SensitivityOutput, swap?: Device): { y: number; grad: Vec } {
  if (out.kind === 'net') {
    const u = ctx.netUnknown(out.net);
    if (u === undefined) throw new Error(`sensitivities: there is no net "${out.net}"`);
    return { y: u < 0 ? 0 : ctx.x[u], grad: u < 0 ? new Map() : new Map([[u, 1]]) };
  }
  const found = ctx.device(out.part);
  if (!found) throw new Error(`sensitivities: part "${out.part}" is not in the solve`);
  const d = swap ?? found.device;
  const { pins, pinNames } = found;
  const cur = d.pinCurrents(ctx.x, ctx.gmin);
  // ∂(current into pin k)/∂x: the device's own Jacobian row at that pin's node. A ground pin's
  // current is minus the others' (the currents into a part sum to zero).
  const rows = new Map<number, Vec>();
  d.begin?.(ctx.x, 'warm');
  ctx.circuit.stampsAt([d], ctx.x, ctx.gmin, {
    add(r, c, v) {
      const row = rows.get(r) ?? new Map<number, number>();
      row.set(c, (row.get(c) ?? 0) + v);
      rows.set(r, row);
    },
    addRhs() {},
  });
  const distinct = new Set(pins.filter((p) => p >= 0)).size === pins.filter((p) => p >= 0).length;
  const grounded = pins.filter((p) => p < 0).length;
  if (!distinct || grounded > 1) throw new Error(`sensitivities: ${out.part} has two pins on one net; ask for a net voltage instead`);
  const pinGrad = (k: number): Vec => {
    if (pins[k] >= 0) return rows.get(pins[k]) ?? new Map();
    const g: Vec = new Map();
    pins.forEach((n, j) => {
      if (j === k) return;
      for (const [c, v] of rows.get(n) ?? []) g.set(c, (g.get(c) ?? 0) - v);
    });
    return g;
  };
  if (out.kind === 'current') {
    const k = pinNames.indexOf(out.pin);
    if (k < 0) throw new Error(`sensitivities: ${out.part} has no pin "${out.pin}"`);
    return { y: cur[k], grad: pinGrad(k) };
  }
  // P = Σ v_k·i_k
  let y = 0;
  const grad: Vec = new Map();
  pins.forEach((n, k) => {
    const v = nodeV(ctx.x, n);
    y += v * cur[k];
    if (n >= 0) grad.set(n, (grad.get(n) ?? 0) + cur[k]);
    for (const [c, g] of pinGrad(k)) grad.set(c, (grad.get(c) ?? 0) + v * g);
  });
  return { y, grad };
}

/** λ with Jᵀ·λ = c, J recorded from every device at x. */
function adjoint(ctx: SensitivityContext, c: Vec): Float64Array | null {
  const n = ctx.circuit.size;
  const entries: Array<[number, number, number]> = [];
  for (const d of ctx.circuit.devices) d.begin?.(ctx.x, 'warm');
  ctx.circuit.stampsAt(ctx.circuit.devices, ctx.x, ctx.gmin, { add: (r, col, v) => entries.push([col, r, v]), addRhs() {} });
  // the diagonal of every node is in the circuit's pattern; keep it in the transposed one too
  for (let i = 0; i < n; i++) entries.push([i, i, 0]);
  const seen = new Set<number>();
  const pattern: Array<readonly [number, number]> = [];
  for (const [r, col] of entries)
    if (!seen.has(r * n + col)) {
      seen.add(r * n + col);
      pattern.push([r, col]);
    }
  const sys = createLinearSystem(ctx.linearSolver, n, pattern);
  sys.clear();
  for (const [r, col, v] of entries) if (v !== 0) sys.add(r, col, v);
  for (const [i, v] of c) sys.addRhs(i, v);
  const lam = sys.solve();
  return lam instanceof Float64Array && lam.every(Number.isFinite) ? lam : null;
}

/**
 * dy/dp for every param in `params` at the circuit's last solution (see SensitivityContext).
 * Throws for a request that names no such net, part or pin (as the circuit's accessors do).
 */
export function adjointSensitivities(ctx: SensitivityContext, out: SensitivityOutput, params: readonly ParamRef[]): SensitivityReport {
  const { y, grad } = outputAt(ctx, out);
  const lam = adjoint(ctx, grad);
  if (!lam) throw new Error('sensitivities: the Jacobian at the operating point is singular');
  const entries = params.map(({ part, param }): SensitivityEntry => {
    const p = ctx.paramValue(part, param);
    if (p === undefined) throw new Error(`sensitivities: part "${part}" has no numeric param "${param}" in the solve`);
    const h = REL_STEP * (Math.abs(p) || 1);
    const up = ctx.perturbed(part, param, p + h);
    const down = ctx.perturbed(part, param, p - h);
    if (typeof up === 'string' || typeof down === 'string')
      return { part, param, value: p, derivative: null, normalized: null, reason: typeof up === 'string' ? up : (down as string) };
    const fUp = residualOf(ctx, up);
    const fDown = residualOf(ctx, down);
    let dF = 0;
    for (const r of new Set([...fUp.keys(), ...fDown.keys()])) dF += lam[r] * ((fUp.get(r) ?? 0) - (fDown.get(r) ?? 0));
    dF /= 2 * h;
    // the output may depend on the param directly (the current of the part whose value moves)
    const direct = out.kind !== 'net' && out.part === part ? (outputAt(ctx, out, up).y - outputAt(ctx, out, down).y) / (2 * h) : 0;
    // restore the circuit's own device state after the perturbed ones were loaded at x
    ctx.device(part)?.device.begin?.(ctx.x, 'warm');
    const derivative = direct - dF;
    return { part, param, value: p, derivative, normalized: y !== 0 && p !== 0 ? (derivative * p) / y : null };
  });
  return { output: y, entries };
}
