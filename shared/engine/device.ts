// What a device model gives the engine. A model turns one part (params already validated and
// defaults filled) into a Device that stamps its linearised companion model into the MNA system
// (Ho, Ruehli & Brennan, "The modified nodal approach to network analysis", IEEE Trans. Circuits
// and Systems 22(6), 1975) and reports its pin currents.

/**
 * Resistances below this (Ω) are ideal 0 Ω links, solved by a branch current: a conductance of
 * 1e6 S or more would swamp the rest of the matrix and lose the current in rounding.
 */
export const LINK_RESISTANCE = 1e-6;

/** true when a resistance is to be treated as an ideal link */
export function isLink(r: number): boolean {
  return r < LINK_RESISTANCE;
}

/** Unknown index of the reference (ground) node: never stamped. */
export const GROUND = -1;

export interface DeviceEnv {
  temperatureC: number;
  temperatureK: number;
  /** thermal voltage k·T/q at temperatureK */
  vt: number;
  illuminanceLux: number;
}

/** Structural view of a part, for the topology diagnostics (pins by index). */
export type TopologyEdge =
  /** a DC path with some impedance (resistors, junctions, loads) */
  | { kind: 'resistive'; a: number; b: number }
  /** a zero-impedance voltage constraint v(a) − v(b) = value (ideal sources, 0 Ω links) */
  | { kind: 'voltage'; a: number; b: number; value: number; source: boolean }
  /** an ideal current source: no DC path */
  | { kind: 'current'; a: number; b: number; value: number };

export interface Allocator {
  /** a new internal node (e.g. between a diode's junction and its series resistance) */
  internalNode(name: string): number;
  /** a new branch-current unknown (voltage sources, zero-ohm links) */
  branch(name: string): number;
}

/** What a device writes to while loading. */
export interface Stamper {
  /** conductance g between nodes a and b (either may be GROUND) */
  conductance(a: number, b: number, g: number): void;
  /** raw matrix entry; ignored when row or col is GROUND */
  add(row: number, col: number, value: number): void;
  /** raw right-hand-side entry; ignored for GROUND */
  addRhs(row: number, value: number): void;
  /** a constant current `i` flowing INTO the device at node a and out at node b */
  current(a: number, b: number, i: number): void;
  /**
   * A non-linear element, linearised: `currents[k]` flows into the device at `nodes[k]`;
   * `controls[m] = [p, q, vLimited]` are the controlling voltages v(p) − v(q) at which the
   * currents were evaluated, and `jac[k][m]` = ∂currents[k]/∂controls[m].
   */
  nonlinear(nodes: readonly number[], currents: readonly number[], controls: ReadonlyArray<readonly [number, number, number]>, jac: ReadonlyArray<readonly number[]>): void;
  /** junction gmin in effect (S), to put in parallel with each pn junction */
  readonly gmin: number;
  /** scale (0..1) for independent sources, for source stepping */
  readonly sourceScale: number;
  /** set when a device limited a junction step this iteration (the iteration cannot be final) */
  markLimited(): void;
}

/** Where a device adds its true (non-linearised) currents for the KCL residual. */
export interface ResidualSink {
  /**
   * Current `i` flowing from `node` into the device. `scale` (A, default |i|) is the size of the
   * terms it is computed from, Σ|g|·|v| (e.g. g·(|v_a| + |v_b|) for a resistance): it tells the
   * convergence test how much of `i` is mere rounding of the voltages.
   */
  add(node: number, i: number, scale?: number): void;
}

export interface DeviceWarning {
  code: string;
  severity: 'caution' | 'warning' | 'danger';
  message: string;
}

export interface DeviceReport {
  /** derived operating quantities shown to users (e.g. resistance at temperature, region) */
  derived?: Record<string, number | string>;
  warnings?: DeviceWarning[];
}

/**
 * How a Newton solve starts. 'warm': from an earlier solution. 'cold' (x all zeros): junctions at
 * their critical voltage and constant-power loads open, as a real circuit powers up. 'cold-loads-on':
 * the same but loads drawing from the start, the fallback when the power-up start fails (a load
 * asking more than its supply can give has no operating point above its minVoltage).
 */
export type StartKind = 'warm' | 'cold' | 'cold-loads-on';

export interface Device {
  readonly partId: string;
  readonly nonlinear: boolean;
  /** true when the device starts differently from a 'cold' and a 'cold-loads-on' start */
  readonly startsOpen?: boolean;
  /** every unknown node the device touches (pins and internal nodes), for movement reporting */
  readonly nodes: readonly number[];
  /** Start of a Newton solve from x (resets junction-limiting memory); see StartKind. */
  begin?(x: Float64Array, start: StartKind): void;
  /** stamp the companion model at iterate x */
  load(s: Stamper, x: Float64Array): void;
  /** add the true currents at x (with the given junction gmin and source scale) to the residual */
  residual(x: Float64Array, sink: ResidualSink, gmin: number, sourceScale: number): void;
  /** currents INTO each pin, in the part's pin order, at the solution x */
  pinCurrents(x: Float64Array, gmin: number): number[];
  /** operating-point report: derived values and warnings */
  report?(x: Float64Array, pinVoltages: readonly number[], pinCurrents: readonly number[]): DeviceReport;
}

export interface DeviceContext<P> {
  partId: string;
  params: P;
  env: DeviceEnv;
  /** unknown index per pin, in pin order (GROUND for the reference net) */
  pins: readonly number[];
  alloc: Allocator;
}

export interface DeviceModel<P = Record<string, unknown>> {
  /** Topology of the part with these params (pin indices), for the structural diagnostics. */
  topology(params: P, env: DeviceEnv): TopologyEdge[];
  /** Physical problems the schema cannot see (returns [field, message] pairs), e.g. an LED whose series resistance eats its forward voltage. */
  check?(params: P, env: DeviceEnv): Array<[string, string]>;
  create(ctx: DeviceContext<P>): Device;
}

/** Read v(node) from x, with ground at 0 V. */
export function nodeV(x: Float64Array, node: number): number {
  return node < 0 ? 0 : x[node];
}
