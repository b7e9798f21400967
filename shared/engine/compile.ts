// Compiling a sheet for repeated operating-point solves: parse and net extraction happen once;
// each solve may override numeric params and conditions, and may warm-start from a previous result.
import { partCatalog, type PartDefinition } from '../parts/index';
import { fmt } from '../parts/model-helpers';
import { describeValue, paramProblem, parseSheet, type SheetIssue } from '../sheet/parse';
import { extractNets, type NetList } from '../sheet/nets';
import { pinKey, type Conditions, type Part, type Sheet } from '../sheet/schema';
import { celsiusToKelvin, thermalVoltage } from './constants';
import { GROUND, type Device, type DeviceEnv, type TopologyEdge } from './device';
import { createLinearSystem, type LinearSolverKind, type LinearSystem, type LinearSystemFactory } from './linear/index';
import { MnaCircuit, deviceMovement, UNKNOWN_BRANCH, UNKNOWN_NODE, type NewtonOutcome, type NewtonRun } from './newton';
import { failure, type PartResult, type SolveErrorInfo, type SolveFailure, type SolveResult, type SolveStrategy, type SolveSuccess, type SolveWarning } from './result';
import { adjointSensitivities, type ParamRef, type SensitivityOutput, type SensitivityReport } from './sensitivity';
import { checkTopology, type PartTopology } from './topology';

export interface SolveOptions {
  /** relative tolerance on Newton steps and KCL residuals (default 1e-6) */
  reltol?: number;
  /** absolute voltage tolerance, V (default 1e-9) */
  vntol?: number;
  /** absolute current tolerance, A (default 1e-14) */
  abstol?: number;
  /** conductance across every pn junction while iterating, S (default 1e-12); the result is then polished without it */
  gmin?: number;
  /** iterations of one Newton run (default 150) */
  maxIterations?: number;
  /** bound on all Newton iterations of one solve, stepping included (default 3000) */
  maxTotalIterations?: number;
  /** try gmin stepping when plain Newton fails (default true) */
  gminStepping?: boolean;
  /** try source stepping when gmin stepping fails (default true) */
  sourceStepping?: boolean;
  /** 'auto' (dense ml-matrix LU up to 150 unknowns, sparse LU above), 'dense', 'band', 'sparse', or a factory */
  linearSolver?: LinearSolverKind | LinearSystemFactory;
}

export type ParamOverrides = Record<string, Record<string, number | boolean>>;

export interface CircuitSolveOptions {
  /** partId → param → value, applied on top of the sheet's params for this solve only */
  paramOverrides?: ParamOverrides;
  /** conditions for this solve only */
  conditions?: Partial<Pick<Conditions, 'temperatureC' | 'illuminanceLux'>>;
  /**
   * Warm start: 'previous' (this circuit's last converged solution), an earlier result of this
   * circuit (exact state), or net voltages by name.
   */
  initialGuess?: 'previous' | SolveSuccess | Record<string, number>;
}

export interface CompiledCircuit {
  /** the validated sheet (defaults filled) — undefined when the sheet was invalid */
  readonly sheet: Sheet | undefined;
  readonly netList: NetList | undefined;
  /** a failure that no param override can fix (invalid sheet, no ground) — solve() returns it */
  readonly error: SolveFailure | null;
  /** unknowns in the base MNA system (nodes + internal nodes + branch currents) */
  readonly unknowns: number;
  readonly linearSolverName: string;
  /** names of the nets in the solve, in result order (empty when the sheet could not be compiled) */
  readonly netNames: string[];
  /** solve and build the full result */
  solve(opts?: CircuitSolveOptions): SolveResult;
  /**
   * Solve without building the result object (for sweeps and Monte Carlo); read what you need
   * with the accessors below, which refer to the last successful solve or solveRaw.
   */
  solveRaw(opts?: CircuitSolveOptions): RawSolveResult;
  /** voltage of a net by name, V (throws when there is no solution yet or no such net) */
  netVoltage(net: string): number;
  pinVoltage(partId: string, pin: string): number;
  /** current INTO the pin, A */
  pinCurrent(partId: string, pin: string): number;
  /** power absorbed by the part, W */
  partPower(partId: string): number;
  /**
   * Adjoint sensitivities at the last successful solve: dy/dp of one output for many params from
   * one transposed solve (shared/engine/sensitivity.ts). `params` defaults to every param with a
   * tolerance (resistances, NTC nominal resistances, supply voltages). Throws when there is no
   * solution yet or the output names no such net, part or pin.
   */
  sensitivities(output: SensitivityOutput, params?: readonly ParamRef[]): SensitivityReport;
}

export type RawSolveResult = { ok: true; iterations: number } | SolveFailure;

const DEFAULTS = {
  reltol: 1e-6,
  vntol: 1e-9,
  abstol: 1e-14,
  gmin: 1e-12,
  maxIterations: 150,
  maxTotalIterations: 3000,
  gminStepping: true,
  sourceStepping: true,
  linearSolver: 'auto' as LinearSolverKind | LinearSystemFactory,
};

type AllocRecord = ReadonlyArray<{ kind: number; index: number }>;
const NO_ALLOCS: AllocRecord = [];

// Per-part facts are kept in arrays indexed by the part's position in sheet.parts (BaseInfo.index
// maps an id to it): a sheet of 10⁴ parts otherwise pays for a handful of 10⁴-entry string maps on
// every compile and one copied map per sweep point.
interface Instance {
  devices: Device[];
  /** position in `devices` of each part's device, by part index (-1: excluded part or connector) */
  devicePos: Int32Array;
  kinds: Uint8Array;
  circuit: MnaCircuit;
  signature: string;
  /** topology edges by part index, as checked (undefined for parts not solved) */
  topo: Array<TopologyEdge[] | undefined>;
  /** unknowns each part's device allocated, in order, by part index */
  allocs: Array<AllocRecord | undefined>;
  /** the params and conditions the devices were made with (overrides merged) */
  paramsOf: (p: Part) => Record<string, unknown>;
  cond: { temperatureC: number; illuminanceLux: number };
}

interface BaseInfo {
  sheet: Sheet;
  nets: NetList;
  /** part id → position in sheet.parts */
  index: Map<string, number>;
  /** net index of each pin, by part index, in the part's pin order */
  pinNets: number[][];
  /** "R1.a" keys of each part's pins, by part index */
  pinKeys: string[][];
  /** unknown index per net (GROUND for ground and inactive nets) */
  netUnknown: Int32Array;
  active: boolean[];
  /** parts in the solve (not isolated), in sheet order */
  solved: Part[];
  /** part index of each entry of `solved` */
  solvedIndex: number[];
  excluded: Set<string>;
  staticWarnings: SolveWarning[];
  /** unknowns that are net voltages (they come first) */
  externalCount: number;
}

function envFor(part: Part, params: Record<string, unknown>, cond: { temperatureC: number; illuminanceLux: number }): DeviceEnv {
  void part;
  const tC = typeof params.temperatureC === 'number' ? params.temperatureC : cond.temperatureC;
  const lux = typeof params.illuminanceLux === 'number' ? params.illuminanceLux : cond.illuminanceLux;
  const tK = celsiusToKelvin(tC);
  return { temperatureC: tC, temperatureK: tK, vt: thermalVoltage(tK), illuminanceLux: lux };
}

/** How a part that takes part in a loop of ideal constraints is described in the message. */
function valueText(part: Part, params: Record<string, unknown>, edges: TopologyEdge[]): string | undefined {
  switch (part.type) {
    case 'dc_voltage_source':
      return fmt(params.voltage as number, 'V');
    case 'switch':
      return 'closed, 0 Ω';
    case 'potentiometer': {
      // which section is the 0 Ω link decides where the wiper sits (a log taper reaches 0 before position 0)
      const awLink = edges[0]?.kind === 'voltage';
      return `wiper at ${awLink ? 'a' : 'b'}, 0 Ω`;
    }
    default:
      // any other part whose resistance came out below 1 µΩ is an ideal link
      return edges.some((e) => e.kind === 'voltage') ? 'below 1 µΩ, an ideal 0 Ω link' : undefined;
  }
}

/** One error for a list of param problems: the first one's message, and how many more there are. */
function invalidParameters(issues: SheetIssue[]): SolveErrorInfo {
  return {
    code: 'invalid_parameter',
    message: issues.length > 1 ? `${issues[0].message.replace(/\.$/, '')} (and ${issues.length - 1} more)` : issues[0].message,
    parts: [...new Set(issues.map((i) => i.partId).filter((id): id is string => !!id))],
    nets: [],
    issues,
  };
}

function buildBase(sheet: Sheet): BaseInfo {
  const nets = extractNets(sheet);
  const staticWarnings: SolveWarning[] = [];
  for (const n of nets.notices) staticWarnings.push({ code: n.code, severity: 'caution', net: n.net, message: n.message });

  const parts = sheet.parts;
  const index = new Map<string, number>();
  const pinNets: number[][] = new Array(parts.length);
  const pinKeys: string[][] = new Array(parts.length);
  for (let i = 0; i < parts.length; i++) {
    index.set(parts[i].id, i);
    pinNets[i] = nets.partPins[i].nets;
    pinKeys[i] = nets.partPins[i].keys;
  }
  const isConnector = (p: Part) => p.type === 'ground' || p.type === 'net_label';

  // parts with nothing connected to any pin are left out of the solve (with a warning): every net
  // one of its pins is on holds only that part's own pins
  const excluded = new Set<string>();
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i];
    if (isConnector(part)) continue;
    const row = pinNets[i];
    const isolated = row.every((n) => nets.nets[n].pins.length === row.reduce((c, m) => c + (m === n ? 1 : 0), 0));
    if (isolated) {
      excluded.add(part.id);
      staticWarnings.push({
        code: 'part_unconnected',
        severity: 'warning',
        partId: part.id,
        message: `${part.id} (${partCatalog[part.type].label.toLowerCase()}) is not connected to anything and was left out of the solve. Wire it up or delete it.`,
      });
    }
  }
  // a net takes part in the solve when it is ground or a part in the solve (not a connector) has a pin on it
  const active: boolean[] = nets.nets.map((n) => n.isGround);
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i];
    if (isConnector(part) || excluded.has(part.id)) continue;
    for (const n of pinNets[i]) active[n] = true;
  }
  // unconnected pins of parts that are in the solve
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i];
    if (excluded.has(part.id) || isConnector(part)) continue;
    const def = partCatalog[part.type];
    def.pins.forEach((pin, k) => {
      const net = nets.nets[pinNets[i][k]];
      if (net.pins.length === 1 && !net.isGround)
        staticWarnings.push({
          code: 'unconnected_pin',
          severity: 'warning',
          partId: part.id,
          net: net.name,
          message: `Pin "${pin.name}" (${pin.label}) of ${part.id} is not connected to anything.`,
        });
    });
  }
  const netUnknown = new Int32Array(nets.nets.length).fill(GROUND);
  let k = 0;
  nets.nets.forEach((n, i) => {
    if (!n.isGround && active[i]) netUnknown[i] = k++;
  });
  const solved: Part[] = [];
  const solvedIndex: number[] = [];
  parts.forEach((p, i) => {
    if (excluded.has(p.id)) return;
    solved.push(p);
    solvedIndex.push(i);
  });
  // unknown params (kept in the file, ignored by the solver), on every part: a misspelt param on a
  // part not yet wired up is still worth knowing about
  for (const part of parts) {
    const def = partCatalog[part.type];
    for (const key of Object.keys(part.params ?? {}))
      if (!def.params.some((p) => p.name === key))
        staticWarnings.push({
          code: 'unknown_param',
          severity: 'caution',
          partId: part.id,
          message: `${part.id} (${part.type}) has a param "${key}" that Tapline does not know; it is ignored. Known params: ${def.params.map((p) => p.name).join(', ') || 'none'}.`,
        });
  }
  return { sheet, nets, index, pinNets, pinKeys, netUnknown, active, solved, solvedIndex, excluded, staticWarnings, externalCount: k };
}

function instantiate(
  base: BaseInfo,
  paramsOf: (p: Part) => Record<string, unknown>,
  cond: { temperatureC: number; illuminanceLux: number },
  opts: typeof DEFAULTS,
  reuse: { system: LinearSystem; signature: string } | null,
): { ok: true; inst: Instance } | { ok: false; error: SolveErrorInfo } {
  const { nets, netUnknown } = base;
  // physical checks and topology
  const issues: SheetIssue[] = [];
  const topo: PartTopology[] = [];
  const partCount = base.sheet.parts.length;
  const topoOf = new Array<TopologyEdge[] | undefined>(partCount);
  const envs = new Array<DeviceEnv | undefined>(partCount);
  base.solved.forEach((part, s) => {
    const i = base.solvedIndex[s];
    const def: PartDefinition = partCatalog[part.type];
    const params = paramsOf(part);
    const env = envFor(part, params, cond);
    envs[i] = env;
    const check = def.model.check?.(params, env);
    if (check) for (const [field, msg] of check) issues.push({ path: `parts.${part.id}.params.${field}`, partId: part.id, field, message: `Part "${part.id}" (${part.type}): field "${field}" ${msg}.` });
    const edges: TopologyEdge[] = def.model.topology(params, env);
    topoOf[i] = edges;
    const vt = valueText(part, params, edges);
    topo.push(vt ? { partId: part.id, type: part.type, pinNets: base.pinNets[i], edges, valueText: vt } : { partId: part.id, type: part.type, pinNets: base.pinNets[i], edges });
  });
  if (issues.length) return { ok: false, error: invalidParameters(issues) };
  const topoError = checkTopology({
    netNames: nets.nets.map((n) => n.name),
    netPins: nets.nets.map((n) => n.pins),
    groundIndex: nets.groundIndex,
    active: base.active,
    parts: topo,
  });
  if (topoError) return { ok: false, error: topoError };

  // devices and unknowns
  const kinds: number[] = [];
  for (let i = 0; i < netUnknown.length; i++) if (netUnknown[i] !== GROUND) kinds.push(UNKNOWN_NODE);
  const names: string[] = [];
  // most parts allocate nothing: the record is made on the first allocation only
  let log: Array<{ kind: number; index: number }> | null = null;
  const record = (kind: number) => {
    kinds.push(kind);
    (log ??= []).push({ kind, index: kinds.length - 1 });
    return kinds.length - 1;
  };
  const alloc = {
    internalNode(name: string) {
      names.push('n:' + name);
      return record(UNKNOWN_NODE);
    },
    branch(name: string) {
      names.push('b:' + name);
      return record(UNKNOWN_BRANCH);
    },
  };
  const devices: Device[] = [];
  const devicePos = new Int32Array(partCount).fill(-1);
  const allocs = new Array<AllocRecord | undefined>(partCount);
  base.solved.forEach((part, s) => {
    if (part.type === 'ground' || part.type === 'net_label') return;
    const i = base.solvedIndex[s];
    const def = partCatalog[part.type];
    const pins = base.pinNets[i].map((n) => netUnknown[n]);
    log = null;
    const dev = def.model.create({ partId: part.id, params: paramsOf(part), env: envs[i]!, pins, alloc });
    allocs[i] = log ?? NO_ALLOCS;
    devicePos[i] = devices.length;
    devices.push(dev);
  });
  const kindArr = Uint8Array.from(kinds);
  const size = kindArr.length;
  // the structure signature decides whether a linear system can be reused
  const probe = new MnaCircuit(size, kindArr, devices, { size, solverName: '', clear() {}, add() {}, addRhs() {}, solve: () => new Float64Array(0) }, opts);
  const pattern = probe.pattern();
  let h = 0;
  for (const [r, c] of pattern) h = (Math.imul(h, 31) + r * 7919 + c) | 0;
  const signature = `${size}:${names.join(',')}:${pattern.length}:${h}`;
  const system = reuse && reuse.signature === signature ? reuse.system : createLinearSystem(opts.linearSolver, size, pattern);
  const circuit = new MnaCircuit(size, kindArr, devices, system, opts);
  return { ok: true, inst: { devices, devicePos, kinds: kindArr, circuit, signature, topo: topoOf, allocs, paramsOf, cond } };
}

function sameTopology(a: TopologyEdge[], b: TopologyEdge[] | undefined): boolean {
  if (!b || a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i].kind !== b[i].kind || a[i].a !== b[i].a || a[i].b !== b[i].b) return false;
  return true;
}

/**
 * The cheap path for overrides: re-create only the devices of `changed` parts on the base
 * structure. Returns null when a change alters the structure (a section becoming a 0 Ω link, a
 * series resistance appearing), so the caller rebuilds everything.
 */
function patchInstance(
  base: BaseInfo,
  baseInst: Instance,
  changed: Iterable<Part>,
  paramsOf: (p: Part) => Record<string, unknown>,
  cond: { temperatureC: number; illuminanceLux: number },
  opts: typeof DEFAULTS,
): { ok: true; inst: Instance } | { ok: false; error: SolveErrorInfo } | null {
  const issues: SheetIssue[] = [];
  const devices = baseInst.devices.slice();
  for (const part of changed) {
    if (base.excluded.has(part.id) || part.type === 'ground' || part.type === 'net_label') continue;
    const i = base.index.get(part.id)!;
    const def = partCatalog[part.type];
    const params = paramsOf(part);
    const env = envFor(part, params, cond);
    for (const [field, msg] of def.model.check?.(params, env) ?? [])
      issues.push({ path: `parts.${part.id}.params.${field}`, partId: part.id, field, message: `Part "${part.id}" (${part.type}): field "${field}" ${msg}.` });
    if (issues.length) continue;
    if (!sameTopology(def.model.topology(params, env), baseInst.topo[i])) return null;
    const rec = baseInst.allocs[i] ?? NO_ALLOCS;
    let k = 0;
    let mismatch = false;
    const replay = (kind: number) => {
      const r = rec[k++];
      if (!r || r.kind !== kind) {
        mismatch = true;
        return 0;
      }
      return r.index;
    };
    const pins = base.pinNets[i].map((n) => base.netUnknown[n]);
    const dev = def.model.create({ partId: part.id, params, env, pins, alloc: { internalNode: () => replay(UNKNOWN_NODE), branch: () => replay(UNKNOWN_BRANCH) } });
    if (mismatch || k !== rec.length) return null;
    devices[baseInst.devicePos[i]] = dev;
  }
  if (issues.length) return { ok: false, error: invalidParameters(issues) };
  const circuit = new MnaCircuit(baseInst.circuit.size, baseInst.kinds, devices, baseInst.circuit.system, opts);
  return { ok: true, inst: { ...baseInst, devices, circuit, paramsOf, cond } };
}

const results = new WeakMap<object, Float64Array>();

function failedCircuit(sheet: Sheet | undefined, netList: NetList | undefined, err: SolveFailure): CompiledCircuit {
  const none = (): never => {
    throw new Error(`no solution: ${err.error.message}`);
  };
  return { sheet, netList, error: err, unknowns: 0, linearSolverName: '', netNames: [], solve: () => err, solveRaw: () => err, netVoltage: none, pinVoltage: none, pinCurrent: none, partPower: none, sensitivities: none };
}

export function compileCircuit(input: Sheet | unknown, options: SolveOptions = {}): CompiledCircuit {
  const opts = { ...DEFAULTS, ...stripUndefined(options) };
  try {
    return compileInner(input, opts);
  } catch (e) {
    const err = failure({ code: 'internal_error', message: `The solver hit an internal error: ${e instanceof Error ? e.message : String(e)}. Please report this sheet.`, parts: [], nets: [] });
    return failedCircuit(undefined, undefined, err);
  }
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

function compileInner(input: unknown, opts: typeof DEFAULTS): CompiledCircuit {
  const parsed = parseSheet(input);
  if (!parsed.ok) {
    const err = failure({
      code: 'invalid_sheet',
      message: parsed.error.message,
      parts: [...new Set(parsed.error.issues.map((i) => i.partId).filter((x): x is string => !!x))],
      nets: [],
      issues: parsed.error.issues,
    });
    return failedCircuit(undefined, undefined, err);
  }
  const sheet = parsed.sheet;
  const base = buildBase(sheet);
  const baseCond = { temperatureC: sheet.conditions.temperatureC, illuminanceLux: sheet.conditions.illuminanceLux };
  if (base.nets.groundIndex < 0) {
    const info = checkTopology({ netNames: [], netPins: [], groundIndex: -1, active: [], parts: [] })!;
    if (sheet.parts.every((p) => p.type === 'net_label')) info.message = 'The sheet has no parts yet. Add a supply, the parts to solve and a ground.';
    const err = failure(info, base.staticWarnings);
    return failedCircuit(sheet, base.nets, err);
  }
  const baseInst = instantiate(base, (p) => p.params as Record<string, unknown>, baseCond, opts, null);
  let lastSystem: { system: LinearSystem; signature: string } | null = baseInst.ok ? { system: baseInst.inst.circuit.system, signature: baseInst.inst.signature } : null;

  const internalError = (e: unknown) =>
    failure({ code: 'internal_error', message: `The solver hit an internal error: ${e instanceof Error ? e.message : String(e)}. Please report this sheet.`, parts: [], nets: [] }, base.staticWarnings);
  const partOf = (id: string): Part | undefined => {
    const i = base.index.get(id);
    return i === undefined ? undefined : sheet.parts[i];
  };
  const deviceOf = (inst: Instance, id: string): Device | undefined => {
    const i = base.index.get(id);
    const pos = i === undefined ? -1 : inst.devicePos[i];
    return pos < 0 ? undefined : inst.devices[pos];
  };
  let last: { inst: Instance; x: Float64Array; gmin: number; iterations: number; strategy: SolveStrategy; cond: { temperatureC: number; illuminanceLux: number } } | null = null;

  /** Validate options, build (or patch) the instance for this solve. */
  const prepare = (so: CircuitSolveOptions): { inst: Instance; cond: { temperatureC: number; illuminanceLux: number } } | SolveFailure => {
    const cond = { ...baseCond, ...stripUndefined(so.conditions ?? {}) };
    for (const [k, v] of [['temperatureC', cond.temperatureC], ['illuminanceLux', cond.illuminanceLux]] as const) {
      const bad = k === 'temperatureC' ? !(Number.isFinite(v) && v > -273.15) : !(Number.isFinite(v) && v >= 0);
      if (bad)
        return failure({ code: 'invalid_parameter', message: `conditions.${k} must be ${k === 'temperatureC' ? 'a temperature above −273.15 °C' : 'zero or more lux'} (got ${describeValue(v)}).`, parts: [], nets: [] }, base.staticWarnings);
    }
    const overrides = so.paramOverrides;
    const hasOverrides = overrides !== undefined && Object.keys(overrides).length > 0;
    const condChanged = cond.temperatureC !== baseCond.temperatureC || cond.illuminanceLux !== baseCond.illuminanceLux;
    if (!hasOverrides && !condChanged) {
      if (!baseInst.ok) return failure(baseInst.error, base.staticWarnings);
      return { inst: baseInst.inst, cond };
    }
    const merged = new Map<string, Record<string, unknown>>();
    if (hasOverrides) {
      const issues: SheetIssue[] = [];
      for (const [id, ov] of Object.entries(overrides!)) {
        const part = partOf(id);
        if (!part) {
          issues.push({ path: `paramOverrides.${id}`, partId: id, message: `paramOverrides: there is no part "${id}" on the sheet.` });
          continue;
        }
        const def = partCatalog[part.type];
        const params = { ...(part.params as Record<string, unknown>), ...ov };
        for (const key of Object.keys(ov)) {
          const info = def.params.find((p) => p.name === key);
          if (!info) {
            issues.push({ path: `paramOverrides.${id}.${key}`, partId: id, field: key, message: `Part "${id}" (${part.type}): there is no param "${key}" to override.` });
            continue;
          }
          const prob = paramProblem(info, params[key]);
          if (prob) issues.push({ path: `paramOverrides.${id}.${key}`, partId: id, field: key, message: `Part "${id}" (${part.type}): field "${key}" ${prob}.` });
        }
        for (const [field, msg] of def.crossCheck?.(params) ?? [])
          issues.push({ path: `paramOverrides.${id}.${field}`, partId: id, field, message: `Part "${id}" (${part.type}): field "${field}" ${msg}.` });
        merged.set(id, params);
      }
      if (issues.length)
        return failure(invalidParameters(issues), base.staticWarnings);
    }
    const paramsOf = (p: Part) => merged.get(p.id) ?? (p.params as Record<string, unknown>);
    if (baseInst.ok) {
      const changed = condChanged ? base.solved : [...merged.keys()].map((id) => partOf(id)!);
      const patched = patchInstance(base, baseInst.inst, changed, paramsOf, cond, opts);
      if (patched && !patched.ok) return failure(patched.error, base.staticWarnings);
      if (patched) return { inst: patched.inst, cond };
    }
    const r = instantiate(base, paramsOf, cond, opts, lastSystem);
    if (!r.ok) return failure(r.error, base.staticWarnings);
    lastSystem = { system: r.inst.circuit.system, signature: r.inst.signature };
    return { inst: r.inst, cond };
  };

  const initialVector = (inst: Instance, g: CircuitSolveOptions['initialGuess']): Float64Array => {
    const n = inst.circuit.size;
    let x0 = new Float64Array(n);
    if (g === 'previous') {
      if (last && last.inst.signature === inst.signature) x0 = last.x.slice();
    } else if (g && typeof g === 'object') {
      const exact = results.get(g);
      if (exact && exact.length === n && (g as SolveSuccess).ok === true && last?.inst.signature === inst.signature) x0 = exact.slice();
      else {
        const byName = (g as SolveSuccess).ok === true ? (g as SolveSuccess).nets : (g as Record<string, number>);
        base.nets.nets.forEach((net, i) => {
          const u = base.netUnknown[i];
          const v = byName[net.name];
          if (u >= 0 && typeof v === 'number' && Number.isFinite(v)) x0[u] = v;
        });
        // internal nodes: start at the voltage of the part's first pin
        const external = base.externalCount;
        for (const d of inst.devices)
          for (const node of d.nodes) if (node >= external && inst.kinds[node] === UNKNOWN_NODE && d.nodes[0] < external) x0[node] = x0[d.nodes[0]];
      }
    }
    return x0;
  };

  const solveRaw = (so: CircuitSolveOptions = {}): RawSolveResult => {
    try {
      const prep = prepare(so);
      if ('ok' in prep) return prep;
      const { inst, cond } = prep;
      const outcome = runStrategies(inst.circuit, initialVector(inst, so.initialGuess), opts);
      if (!outcome.ok) return { ...failure(describeFailure(outcome, inst, base), base.staticWarnings), iterations: outcome.iterations };
      for (let i = 0; i < outcome.x.length; i++)
        if (!Number.isFinite(outcome.x[i])) return failure({ code: 'non_finite', message: 'The solve produced a value that is not a finite number. Check for extreme parameter values.', parts: [], nets: [] }, base.staticWarnings);
      last = { inst, x: outcome.x, gmin: outcome.gminUsed, iterations: outcome.iterations, strategy: outcome.strategy, cond };
      return { ok: true, iterations: outcome.iterations };
    } catch (e) {
      return internalError(e);
    }
  };

  const solve = (so: CircuitSolveOptions = {}): SolveResult => {
    const raw = solveRaw(so);
    if (!raw.ok) return raw;
    try {
      const l = last!;
      const res = assemble(base, l.inst, l.x, l.gmin, l.cond, l.iterations, l.strategy);
      if (res.ok) results.set(res, l.x);
      return res;
    } catch (e) {
      return internalError(e);
    }
  };

  const needLast = () => {
    if (!last) throw new Error('no solution yet: call solveRaw() or solve() first, and check that it succeeded');
    return last;
  };
  const pinVoltageOf = (l: NonNullable<typeof last>, partId: string, pin: string) => {
    const idx = base.nets.pinToIndex.get(pinKey(partId, pin));
    if (idx === undefined) throw new Error(`no pin ${partId}.${pin}`);
    const u = base.netUnknown[idx];
    return u < 0 ? 0 : l.x[u];
  };
  const partCurrents = (l: NonNullable<typeof last>, partId: string): number[] => {
    const part = partOf(partId);
    if (!part) throw new Error(`no part ${partId}`);
    const dev = deviceOf(l.inst, partId);
    return dev ? dev.pinCurrents(l.x, l.gmin) : partCatalog[part.type].pins.map(() => 0);
  };

  return {
    sheet,
    netList: base.nets,
    error: null,
    unknowns: baseInst.ok ? baseInst.inst.circuit.size : 0,
    linearSolverName: baseInst.ok ? baseInst.inst.circuit.system.solverName : '',
    netNames: base.nets.nets.filter((_, i) => base.active[i]).map((n) => n.name),
    solve,
    solveRaw,
    netVoltage(net) {
      const l = needLast();
      const n = base.nets.byName.get(net);
      if (!n) throw new Error(`no net "${net}"`);
      const u = base.netUnknown[n.index];
      return u < 0 ? 0 : l.x[u];
    },
    pinVoltage(partId, pin) {
      return pinVoltageOf(needLast(), partId, pin);
    },
    pinCurrent(partId, pin) {
      const l = needLast();
      const part = partOf(partId);
      if (!part) throw new Error(`no part ${partId}`);
      const k = partCatalog[part.type].pins.findIndex((p) => p.name === pin);
      if (k < 0) throw new Error(`no pin ${partId}.${pin}`);
      return partCurrents(l, partId)[k];
    },
    sensitivities(output, params) {
      const l = needLast();
      const inst = l.inst;
      const pinsOf = (part: Part) => base.pinNets[base.index.get(part.id)!].map((n) => base.netUnknown[n]);
      const wanted =
        params ??
        base.solved.flatMap((part) => (deviceOf(inst, part.id) ? partCatalog[part.type].params.filter((p) => p.tolerance && p.kind === 'number').map((p) => ({ part: part.id, param: p.name })) : []));
      return adjointSensitivities(
        {
          circuit: inst.circuit,
          x: l.x,
          gmin: l.gmin,
          linearSolver: opts.linearSolver,
          netUnknown(net) {
            const n = base.nets.byName.get(net);
            return n === undefined ? undefined : base.netUnknown[n.index];
          },
          device(partId) {
            const part = partOf(partId);
            const device = deviceOf(inst, partId);
            if (!part || !device) return undefined;
            return { device, pins: pinsOf(part), pinNames: partCatalog[part.type].pins.map((p) => p.name) };
          },
          paramValue(partId, param) {
            const part = partOf(partId);
            const v = part ? inst.paramsOf(part)[param] : undefined;
            return typeof v === 'number' && deviceOf(inst, partId) ? v : undefined;
          },
          perturbed(partId, param, value) {
            const part = partOf(partId)!;
            const def = partCatalog[part.type];
            const info = def.params.find((p) => p.name === param);
            const next = { ...inst.paramsOf(part), [param]: value };
            const env = envFor(part, next, inst.cond);
            const problem = (info && paramProblem(info, value)) || def.crossCheck?.(next)[0]?.[1] || def.model.check?.(next, env)[0]?.[1];
            if (problem) return `${param} = ${value} ${problem}`;
            if (!sameTopology(def.model.topology(next, env), inst.topo[base.index.get(partId)!])) return `moving ${param} changes the circuit's structure here (a 0 Ω link appears or goes)`;
            const rec = inst.allocs[base.index.get(partId)!] ?? NO_ALLOCS;
            let k = 0;
            let mismatch = false;
            const replay = (kind: number) => {
              const r = rec[k++];
              if (!r || r.kind !== kind) mismatch = true;
              return r ? r.index : 0;
            };
            const d = def.model.create({ partId, params: next, env, pins: pinsOf(part), alloc: { internalNode: () => replay(UNKNOWN_NODE), branch: () => replay(UNKNOWN_BRANCH) } });
            return mismatch || k !== rec.length ? `moving ${param} changes how ${partId} is modelled (its unknowns change)` : d;
          },
        },
        output,
        wanted,
      );
    },
    partPower(partId) {
      const l = needLast();
      const part = partOf(partId)!;
      const cur = partCurrents(l, partId);
      let p = 0;
      partCatalog[part.type].pins.forEach((pin, k) => (p += pinVoltageOf(l, partId, pin.name) * cur[k]));
      return p;
    },
  };
}

interface StrategyOutcomeOk {
  ok: true;
  x: Float64Array;
  iterations: number;
  strategy: SolveStrategy;
  gminUsed: number;
}
interface StrategyOutcomeFail {
  ok: false;
  iterations: number;
  last: NewtonOutcome;
  singular?: number[];
  tried: string[];
  exhausted: boolean;
  /** the only solution found balances through the junction gmin, which carries this much (A) */
  gminCarries?: number;
  gminSolution?: Float64Array;
}

/** A gmin solution whose gmin currents exceed this (A) is no operating point (see finish()). */
const GMIN_CARRY_LIMIT = 1e-9;

function runStrategies(c: MnaCircuit, x0: Float64Array, opts: typeof DEFAULTS): StrategyOutcomeOk | StrategyOutcomeFail {
  let total = 0;
  const budgetLeft = () => opts.maxTotalIterations - total;
  const run = (x: Float64Array, r: Omit<NewtonRun, 'maxIterations'>, maxIt = opts.maxIterations): NewtonOutcome => {
    const out = c.newton(x, { ...r, maxIterations: Math.max(1, Math.min(maxIt, budgetLeft())) });
    total += out.iterations;
    return out;
  };
  const gmin = opts.gmin;
  const tried: string[] = ['Newton–Raphson'];
  c.resetScaling();
  const first = run(x0, { gmin, sourceScale: 1, shunt: 0 });
  let best: NewtonOutcome = first;
  let singular = first.singular;
  const finish = (x: Float64Array, strategy: SolveStrategy): StrategyOutcomeOk | StrategyOutcomeFail => {
    // polish without the junction gmin so results are those of the exact device equations
    if (c.nonlinear && gmin > 0 && budgetLeft() > 0) {
      const p = run(x, { gmin: 0, sourceScale: 1, shunt: 0 }, 30);
      if (p.converged) return { ok: true, x: p.x, iterations: total, strategy, gminUsed: 0 };
      // The gmin solution may stand only where gmin merely picks among equally valid answers (a
      // node held by reverse-biased junctions alone, whose exact conductance underflows). When
      // it carries real current (a current source into a blocking junction: 1 mA through
      // 1e-12 S at 1e9 V) there is no operating point at all.
      const share = c.gminShare(x, gmin);
      if (share.gminAmps > Math.max(GMIN_CARRY_LIMIT, 1e-6 * share.scaleAmps))
        return { ok: false, iterations: total, last: { ...p, x, prev: x }, tried, exhausted: false, gminCarries: share.gminAmps, gminSolution: x };
    }
    return { ok: true, x, iterations: total, strategy, gminUsed: c.nonlinear ? gmin : 0 };
  };
  if (first.converged) return finish(first.x, c.nonlinear ? 'newton' : 'direct');
  if (!c.nonlinear) return { ok: false, iterations: total, last: first, ...(singular ? { singular } : {}), tried, exhausted: false };

  // a constant-power load asking more than its supply can give has no operating point above its
  // minVoltage; from the power-up start Newton then wanders, while loads drawing from 0 V find the
  // undervoltage point at once
  if (c.hasPowerUpStart && x0.every((v) => v === 0) && budgetLeft() > 0) {
    const r = run(x0, { gmin, sourceScale: 1, shunt: 0, loadsOnAtStart: true });
    if (r.converged) return finish(r.x, 'newton');
  }

  // gmin stepping: a shunt from every node to ground, reduced step by step
  if (opts.gminStepping && budgetLeft() > 0) {
    tried.push('gmin stepping');
    let shunt = 1e-2;
    let r = run(x0, { gmin, sourceScale: 1, shunt });
    if (r.converged) {
      let factor = 10;
      while (shunt > 1e-13 && budgetLeft() > 0) {
        const next = shunt / factor;
        const t = run(r.x, { gmin, sourceScale: 1, shunt: next });
        if (t.converged) {
          r = t;
          shunt = next;
          factor = Math.min(factor * 2, 1e3);
        } else {
          factor = Math.sqrt(factor);
          if (factor < 1.05) break;
        }
      }
      if (shunt <= 1e-13) {
        const f = run(r.x, { gmin, sourceScale: 1, shunt: 0 });
        if (f.converged) return finish(f.x, 'gmin-stepping');
        best = f;
      }
    } else if (r.singular) singular = r.singular;
  }

  // source stepping: ramp every independent source from 0 to its value
  if (opts.sourceStepping && budgetLeft() > 0) {
    tried.push('source stepping');
    let lam = 0;
    let r = run(new Float64Array(c.size), { gmin, sourceScale: 0, shunt: 0 });
    if (r.converged) {
      let step = 0.1;
      while (lam < 1 && budgetLeft() > 0) {
        const next = Math.min(1, lam + step);
        const t = run(r.x, { gmin, sourceScale: next, shunt: 0 });
        if (t.converged) {
          r = t;
          lam = next;
          step = Math.min(step * 2, 0.5);
        } else {
          best = t;
          step /= 4;
          if (step < 1e-4) break;
        }
      }
      if (lam >= 1) return finish(r.x, 'source-stepping');
    }
  }
  return { ok: false, iterations: total, last: best, ...(singular ? { singular } : {}), tried, exhausted: budgetLeft() <= 0 };
}

const unknownNames = new WeakMap<BaseInfo, Map<number, string>>();
/** The net whose voltage is unknown i, or null (an internal node or a branch current). */
function unknownName(base: BaseInfo, i: number): string | null {
  let m = unknownNames.get(base);
  if (!m) {
    m = new Map();
    for (let k = 0; k < base.netUnknown.length; k++) if (base.netUnknown[k] >= 0) m.set(base.netUnknown[k], base.nets.nets[k].name);
    unknownNames.set(base, m);
  }
  return m.get(i) ?? null;
}

function describeFailure(o: StrategyOutcomeFail, inst: Instance, base: BaseInfo): SolveErrorInfo {
  if (o.gminCarries !== undefined && o.gminSolution) {
    const x = o.gminSolution;
    // the nets with the most extreme voltages are where the current has nowhere to go
    const nets: Array<{ net: string; v: number }> = [];
    base.nets.nets.forEach((net, k) => {
      const u = base.netUnknown[k];
      if (u >= 0) nets.push({ net: net.name, v: x[u] });
    });
    nets.sort((a, b) => Math.abs(b.v) - Math.abs(a.v));
    const top = nets.slice(0, 3);
    const hot = new Set(top.map((n) => base.netUnknown[base.nets.byName.get(n.net)!.index]));
    const parts = inst.devices.filter((d) => d.nonlinear && d.nodes.some((nd) => hot.has(nd))).map((d) => d.partId).slice(0, 6);
    return {
      code: 'no_convergence',
      message: `There is no operating point: the current into ${top.length ? `net "${top[0].net}"` : 'the circuit'} can only flow through ${parts.length ? parts.join(', ') : 'a junction'} in the direction ${parts.length > 1 ? 'they block' : 'it blocks'} (the equations balance only through the solver's 1e-12 S helper conductance, at ${fmt(top[0]?.v ?? 0, 'V')}). A current source feeding a reverse-biased diode or transistor junction does this: give the current another path, or turn the part around.`,
      parts,
      nets: top.map((n) => n.net),
    };
  }
  if (o.last.nonFinite) {
    const bad = new Set(o.last.nonFinite);
    const nets = o.last.nonFinite.map((u) => unknownName(base, u)).filter((x): x is string => !!x).slice(0, 6);
    const parts = inst.devices.filter((d) => d.nodes.some((nd) => bad.has(nd))).map((d) => d.partId).slice(0, 6);
    return {
      code: 'non_finite',
      message: `The solve produced a voltage or current too large for a number (beyond 1.8e308)${nets.length ? ` at ${nets.map((n) => `"${n}"`).join(', ')}` : ''}${parts.length ? ` (parts ${parts.join(', ')})` : ''}. Check for extreme parameter values, such as a huge current source driving a huge resistance.`,
      parts,
      nets,
    };
  }
  if (o.singular && (!inst.circuit.nonlinear || o.last.singular)) {
    const nets = o.singular.map((u) => unknownName(base, u)).filter((x): x is string => !!x);
    const parts = new Set<string>();
    for (const d of inst.devices) if (d.nodes.some((nd) => o.singular!.includes(nd))) parts.add(d.partId);
    return {
      code: 'singular_matrix',
      message: `The circuit equations have no unique solution${nets.length ? ` at net${nets.length > 1 ? 's' : ''} ${nets.map((s) => `"${s}"`).join(', ')}` : ''}${parts.size ? ` (parts ${[...parts].join(', ')})` : ''}: a voltage or a source current there is not determined. Look for parts that only connect to each other, ideal sources or 0 Ω links in a loop, an open switch isolating part of the circuit, or values so extreme that one part's conductance swamps all the others.`,
      parts: [...parts],
      nets,
    };
  }
  const moves = deviceMovement(inst.devices, o.last.x, o.last.prev)
    .filter((m) => m.change > 1e-9)
    .sort((a, b) => b.change - a.change || a.partId.localeCompare(b.partId));
  const nonlinearIds = new Set(inst.devices.filter((d) => d.nonlinear).map((d) => d.partId));
  const moving = [...moves.filter((m) => nonlinearIds.has(m.partId)), ...moves.filter((m) => !nonlinearIds.has(m.partId))].slice(0, 6);
  const netMoves: Array<{ net: string; change: number }> = [];
  base.nets.nets.forEach((net, k) => {
    const u = base.netUnknown[k];
    if (u < 0) return;
    const ch = Math.abs(o.last.x[u] - o.last.prev[u]);
    if (ch > 1e-9) netMoves.push({ net: net.name, change: ch });
  });
  netMoves.sort((a, b) => b.change - a.change);
  const parts = moving.length ? moving.map((m) => m.partId) : [...nonlinearIds];
  const list = moving.length
    ? moving.map((m) => `${m.partId} (its voltages changed by ${fmt(m.change, 'V')} in the last iteration)`).join(', ')
    : [...nonlinearIds].join(', ');
  return {
    code: 'no_convergence',
    message: `The operating point did not converge within ${o.iterations} iterations (tried ${o.tried.join(', ')}). Still moving: ${list}. Check for a constant-power load asking more than the supply can give, parts connected backwards, or extreme parameter values.`,
    parts,
    nets: netMoves.slice(0, 6).map((m) => m.net),
  };
}

/**
 * rec[key] = value as an own property even for the key "__proto__" (a legal part id and net label),
 * where plain assignment would replace the record's prototype and lose the value.
 */
function setOwn<T>(rec: Record<string, T>, key: string, value: T): void {
  if (key === '__proto__') Object.defineProperty(rec, key, { value, enumerable: true, writable: true, configurable: true });
  else rec[key] = value;
}

function assemble(
  base: BaseInfo,
  inst: Instance,
  x: Float64Array,
  gminUsed: number,
  cond: { temperatureC: number; illuminanceLux: number },
  iterations: number,
  strategy: SolveStrategy,
): SolveResult {
  const nets: Record<string, number> = {};
  base.nets.nets.forEach((net, i) => {
    if (!base.active[i]) return;
    const u = base.netUnknown[i];
    setOwn(nets, net.name, u < 0 ? 0 : x[u] === 0 ? 0 : x[u]);
  });
  const pins: Record<string, number> = {};
  const parts: Record<string, PartResult> = {};
  const warnings: SolveWarning[] = [...base.staticWarnings];
  const bad: string[] = [];
  // static warnings by part, once (a filter per part costs parts × warnings)
  const staticByPart = new Map<string, SolveWarning[]>();
  for (const w of base.staticWarnings)
    if (w.partId !== undefined) {
      const list = staticByPart.get(w.partId) ?? [];
      list.push(w);
      staticByPart.set(w.partId, list);
    }
  const all = base.sheet.parts;
  for (let i = 0; i < all.length; i++) {
    const part = all[i];
    const def = partCatalog[part.type];
    const own = staticByPart.get(part.id);
    const partWarnings: SolveWarning[] = own ? own.slice() : [];
    const pinNames = def.pins;
    const pinCurrents: Record<string, number> = {};
    if (base.excluded.has(part.id)) {
      for (const p of pinNames) pinCurrents[p.name] = 0;
      setOwn(parts, part.id, { pinCurrents, power: 0, warnings: partWarnings });
      continue;
    }
    const netsOfPins = base.pinNets[i];
    const keys = base.pinKeys[i];
    const pv = new Array<number>(netsOfPins.length);
    for (let k = 0; k < netsOfPins.length; k++) {
      const u = base.netUnknown[netsOfPins[k]];
      const v = u < 0 ? 0 : x[u];
      pv[k] = v;
      pins[keys[k]] = v === 0 ? 0 : v; // −0 reads as 0
    }
    const pos = inst.devicePos[i];
    const dev = pos < 0 ? undefined : inst.devices[pos];
    const pi = dev ? dev.pinCurrents(x, gminUsed) : pinNames.map(() => 0);
    let power = 0;
    let finite = true;
    for (let k = 0; k < pi.length; k++) {
      power += pv[k] * pi[k];
      pinCurrents[pinNames[k].name] = pi[k] === 0 ? 0 : pi[k];
      if (!Number.isFinite(pi[k])) finite = false;
    }
    const rep = dev?.report?.(x, pv, pi);
    if (rep?.warnings)
      for (const w of rep.warnings) {
        const sw: SolveWarning = { code: w.code, severity: w.severity, partId: part.id, message: w.message };
        partWarnings.push(sw);
        warnings.push(sw);
      }
    if (!finite || !Number.isFinite(power)) bad.push(part.id);
    const derived = rep?.derived;
    if (derived) for (const key in derived) if (typeof derived[key] === 'number' && !Number.isFinite(derived[key])) bad.push(part.id);
    setOwn(parts, part.id, derived ? { pinCurrents, power: power === 0 ? 0 : power, warnings: partWarnings, derived } : { pinCurrents, power: power === 0 ? 0 : power, warnings: partWarnings });
  }
  const badNets: string[] = [];
  for (const name in nets) if (!Number.isFinite(nets[name])) badNets.push(name);
  if (bad.length || badNets.length)
    return failure(
      {
        code: 'non_finite',
        message: `The solve produced a value that is not a finite number${bad.length ? ` for ${[...new Set(bad)].join(', ')}` : ''}${badNets.length ? ` at ${badNets.join(', ')}` : ''}. Check for extreme parameter values.`,
        parts: [...new Set(bad)],
        nets: badNets,
      },
      base.staticWarnings,
    );
  return {
    ok: true,
    analysis: 'operating-point',
    nets,
    pins,
    parts,
    warnings,
    iterations,
    strategy,
    conditions: { temperatureC: cond.temperatureC, illuminanceLux: cond.illuminanceLux },
  };
}

/** Solve the DC operating point of a sheet (validated here; never throws). */
export function solveOperatingPoint(sheet: Sheet | unknown, options?: SolveOptions): SolveResult {
  return compileCircuit(sheet, options).solve();
}
