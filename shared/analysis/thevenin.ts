// The Thevenin equivalent seen at a net (against the reference net "0"): the open-circuit voltage,
// and the source resistance from a test current injected into the net — two small injections of
// opposite sign, R = ΔV/ΔI (a central difference). For a linear circuit that is exact; for a
// non-linear one it is the small-signal (incremental) resistance at the operating point, which
// predicts small loads only: for a heavy load, solve with the load on the sheet instead.
import type { CircuitSolveOptions } from '../engine/compile';
import { GROUND_NET } from '../sheet/nets';
import type { Sheet } from '../sheet/schema';
import { prepareCircuit, solveOrThrow } from './evaluate';
import { AnalysisInputError } from './targets';

export interface TheveninResult {
  net: string;
  /** open-circuit voltage, V */
  openCircuitVoltage: number;
  /** source resistance, Ω (small-signal for a non-linear circuit) */
  resistance: number;
  /** V_oc / R: the current a short to ground would draw if the circuit stayed linear, A */
  shortCircuitCurrent: number;
  /** test current used for the resistance, A */
  testCurrent: number;
  /** the circuit has non-linear parts: the resistance is incremental at this operating point */
  smallSignal: boolean;
}

const PROBE = '__thevenin_probe';
const PROBE_GND = '__thevenin_gnd';
const NONLINEAR = new Set(['diode', 'zener', 'led', 'npn', 'pnp']);

/** The sheet with a test current source from `net` to ground (current 0 until overridden). */
export function sheetWithProbe(sheet: Sheet, net: string, netPin: string): Sheet {
  return {
    ...sheet,
    parts: [...sheet.parts, { id: PROBE, type: 'dc_current_source', params: { current: 0 } }, { id: PROBE_GND, type: 'ground', params: {} }] as Sheet['parts'],
    wires: [...sheet.wires, { from: `${PROBE}.pos`, to: netPin }, { from: `${PROBE}.neg`, to: `${PROBE_GND}.g` }],
  };
}

/**
 * Thevenin equivalent at `net`. @throws AnalysisInputError (no such net, the reference net),
 * CircuitFailureError (the sheet does not solve)
 */
export function theveninAt(sheetInput: Sheet | unknown, net: string, base: CircuitSolveOptions = {}): TheveninResult {
  const p0 = prepareCircuit(sheetInput);
  if (net === GROUND_NET) throw new AnalysisInputError('The reference net "0" has no Thevenin equivalent against itself; choose another net.');
  const found = p0.nets.byName.get(net);
  if (!found) throw new AnalysisInputError(`There is no net "${net}". Nets on this sheet: ${p0.nets.nets.map((n) => n.name).join(', ')}.`);
  const p = prepareCircuit(sheetWithProbe(p0.sheet, net, found.pins[0]));
  const at = (current: number): number => {
    const r = solveOrThrow(p, { ...base, paramOverrides: { ...(base.paramOverrides ?? {}), [PROBE]: { current } } });
    return r.nets[net];
  };
  const voc = at(0);
  // a first probe sizes the real one so the net moves by about 1 mV (linear enough for junctions)
  const i0 = 1e-6;
  const r0 = Math.abs((at(i0) - at(-i0)) / (2 * i0));
  const di = r0 > 0 && Number.isFinite(r0) ? 1e-3 / r0 : i0;
  const resistance = (at(di) - at(-di)) / (2 * di);
  at(0); // leave the warm start at the open-circuit point
  return {
    net,
    openCircuitVoltage: voc,
    resistance,
    shortCircuitCurrent: voc / resistance,
    testCurrent: di,
    smallSignal: p.sheet.parts.some((q) => NONLINEAR.has(q.type) || (q.type === 'load' && (q.params as { mode?: string }).mode === 'power')),
  };
}
