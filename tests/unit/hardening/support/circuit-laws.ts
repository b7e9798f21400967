// Does a reported operating point obey Kirchhoff's laws and every part's own law? Checked from the
// result alone, with nets grouped again here (union–find over the wires, ground pins and labels, as
// shared/contracts/sheet-format.md defines them) rather than taken from the engine.
//
// - KCL: at every net the currents into the parts sum to zero (within the stated tolerance).
// - KVL: voltages are node potentials, so every loop sums to zero once each branch obeys its law;
//   what is left to check is that each voltage source holds v(pos) − v(neg) − R·i = V and each part's
//   current matches its law at the reported pin voltages (device-laws.ts).
import { parseSheet } from '../../../../shared/sheet';
import type { SolveSuccess } from '../../../../shared/engine';
import { deviceLaw, type Params } from './device-laws';

export interface Tolerances {
  /** KCL: |Σ i| ≤ relative·max|i| + absolute at every net */
  kclRelative: number;
  kclAbsolute: number;
  /** device laws: |i − law| ≤ relative·|law| + absolute (+ the rounding of the pin voltages) */
  lawRelative: number;
  lawAbsolute: number;
  /** voltage constraints (sources, 0 Ω links): |error| ≤ relative·(|V| + |R·i| + |v|) + absolute, V */
  kvlRelative?: number;
  kvlAbsolute?: number;
}

export const DEFAULT_TOLERANCES: Tolerances = { kclRelative: 1e-9, kclAbsolute: 1e-15, lawRelative: 1e-9, lawAbsolute: 1e-15 };

const PINS: Record<string, string[]> = {
  resistor: ['a', 'b'],
  potentiometer: ['a', 'w', 'b'],
  dc_voltage_source: ['pos', 'neg'],
  dc_current_source: ['pos', 'neg'],
  diode: ['anode', 'cathode'],
  zener: ['anode', 'cathode'],
  led: ['anode', 'cathode'],
  npn: ['c', 'b', 'e'],
  pnp: ['c', 'b', 'e'],
  ntc: ['a', 'b'],
  ldr: ['a', 'b'],
  load: ['pos', 'neg'],
  switch: ['a', 'b'],
  ground: ['g'],
  net_label: ['n'],
};

interface RawPart {
  id: string;
  type: string;
  params: Params;
}

/** Group pins into nets: wires join pins, ground pins are one net, labels with one name are one net. */
export function groupNets(parts: RawPart[], wires: Array<{ from: string; to: string }>): Map<string, number> {
  const parent = new Map<string, string>();
  const find = (k: string): string => {
    let r = k;
    while (parent.get(r) !== r) r = parent.get(r)!;
    parent.set(k, r);
    return r;
  };
  const join = (a: string, b: string) => {
    if (!parent.has(a) || !parent.has(b)) return;
    parent.set(find(a), find(b));
  };
  for (const p of parts) for (const pin of PINS[p.type] ?? []) parent.set(`${p.id}.${pin}`, `${p.id}.${pin}`);
  for (const w of wires) join(w.from, w.to);
  const byLabel = new Map<string, string>();
  for (const p of parts) {
    const key = p.type === 'ground' ? '0' : p.type === 'net_label' ? String(p.params.name).trim() : null;
    if (key === null) continue;
    const pin = `${p.id}.${p.type === 'ground' ? 'g' : 'n'}`;
    const first = byLabel.get(key);
    if (first) join(pin, first);
    else byLabel.set(key, pin);
  }
  const ids = new Map<string, number>();
  const out = new Map<string, number>();
  for (const k of parent.keys()) {
    const r = find(k);
    if (!ids.has(r)) ids.set(r, ids.size);
    out.set(k, ids.get(r)!);
  }
  // the ground net is index -1 so callers can find it
  const g = byLabel.get('0');
  if (g) {
    const gi = out.get(g)!;
    for (const [k, v] of out) if (v === gi) out.set(k, -1);
  }
  return out;
}

export interface LawReport {
  violations: string[];
  /** worst KCL residual as a fraction of its tolerance (≤ 1 passes) */
  worstKcl: number;
  /** worst device-law mismatch as a fraction of its tolerance (≤ 1 passes) */
  worstLaw: number;
}

/** Check a successful result against Kirchhoff's laws and the device laws. */
export function checkCircuitLaws(sheetInput: unknown, r: SolveSuccess, tol: Tolerances = DEFAULT_TOLERANCES, skipLaws: readonly string[] = []): LawReport {
  const parsed = parseSheet(sheetInput);
  if (!parsed.ok) return { violations: ['the sheet does not parse'], worstKcl: Infinity, worstLaw: Infinity };
  const sheet = parsed.sheet;
  const parts = sheet.parts as unknown as RawPart[];
  const netOf = groupNets(parts, sheet.wires);
  const violations: string[] = [];
  let worstKcl = 0;
  let worstLaw = 0;
  const eps = Number.EPSILON;

  // pin voltages: one value per net, 0 on ground, all finite
  const netV = new Map<number, number>();
  for (const [pin, v] of Object.entries(r.pins)) {
    if (!Number.isFinite(v)) violations.push(`pin ${pin}: voltage ${v}`);
    const n = netOf.get(pin);
    if (n === undefined) {
      violations.push(`pin ${pin} is not on the sheet`);
      continue;
    }
    if (n === -1 && v !== 0) violations.push(`pin ${pin} is on ground but at ${v} V`);
    const seen = netV.get(n);
    if (seen === undefined) netV.set(n, v);
    else if (seen !== v) violations.push(`pins of one net differ: ${pin} at ${v} V, another at ${seen} V`);
  }

  const sum = new Map<number, number>();
  const big = new Map<number, number>();
  const noise = new Map<number, number>();
  // nets joined by a part with a branch current (a voltage source, a 0 Ω link): that current is
  // fixed by KCL at one end and carries its rounding to the other
  const ideal: number[][] = [];
  for (const p of parts) {
    const res = Object.prototype.hasOwnProperty.call(r.parts, p.id) ? r.parts[p.id] : undefined;
    if (!res) {
      violations.push(`part ${p.id} is missing from the result`);
      continue;
    }
    const pins = PINS[p.type] ?? [];
    const cur = pins.map((pin) => res.pinCurrents[pin]);
    if (p.type === 'ground' || p.type === 'net_label') continue;
    if (cur.some((i) => typeof i !== 'number' || !Number.isFinite(i))) {
      violations.push(`part ${p.id}: a pin current is not a finite number`);
      continue;
    }
    const inSolve = pins.every((pin) => Object.prototype.hasOwnProperty.call(r.pins, `${p.id}.${pin}`));
    if (!inSolve) {
      if (cur.some((i) => i !== 0)) violations.push(`part ${p.id} is left out of the solve but carries current`);
      continue;
    }
    const v = pins.map((pin) => r.pins[`${p.id}.${pin}`]);
    const vScale = v.reduce((a, b) => a + Math.abs(b), 0);
    pins.forEach((pin, k) => {
      const n = netOf.get(`${p.id}.${pin}`)!;
      sum.set(n, (sum.get(n) ?? 0) + cur[k]);
      big.set(n, Math.max(big.get(n) ?? 0, Math.abs(cur[k])));
    });
    if (p.type === 'potentiometer') {
      // the wiper current is the difference of the two section currents, and rounds like them
      const n = netOf.get(`${p.id}.w`)!;
      big.set(n, Math.max(big.get(n) ?? 0, Math.abs(cur[0]), Math.abs(cur[2])));
    }
    const pinSum = cur.reduce((a, b) => a + b, 0);
    const pinScale = Math.max(...cur.map(Math.abs));
    if (Math.abs(pinSum) > 1e-12 * pinScale + 1e-300) violations.push(`part ${p.id}: pin currents sum to ${pinSum} A`);

    if (p.type === 'dc_voltage_source') {
      ideal.push(pins.map((pin) => netOf.get(`${p.id}.${pin}`)!));
      const V = p.params.voltage as number;
      const R = (p.params.internalResistance as number) < 1e-6 ? 0 : (p.params.internalResistance as number);
      const err = v[0] - v[1] - R * cur[0] - V;
      const t = (tol.kvlRelative ?? 1e-12) * (Math.abs(V) + Math.abs(R * cur[0]) + vScale) + (tol.kvlAbsolute ?? 1e-15);
      if (Math.abs(err) > t) violations.push(`source ${p.id}: v(pos) − v(neg) − R·i − V = ${err} V`);
      continue;
    }
    const law = skipLaws.includes(p.id) ? null : deviceLaw(p.type, p.params, v, { temperatureC: sheet.conditions.temperatureC, illuminanceLux: sheet.conditions.illuminanceLux });
    if (!law) {
      // no law to weigh the rounding with: allow for the rounding of the part's largest current
      // (a pin current may be the difference of two far larger ones, as a transistor's emitter)
      pins.forEach((pin) => {
        const n = netOf.get(`${p.id}.${pin}`)!;
        noise.set(n, (noise.get(n) ?? 0) + 16 * eps * pinScale);
      });
      continue;
    }
    // how far the rounding of the pin voltages alone moves the current, and gmin (1e-12 S) when a
    // node held only by reverse-biased junctions keeps it (docs/engine.md, "gmin")
    // a law too sharp for its own slope to be a number (e.g. a 5e-324 Ω knee) weighs nothing here
    const slope = Number.isFinite(law.slope) ? law.slope : 0;
    const rounding = 16 * eps * slope * vScale + 2e-12 * vScale;
    pins.forEach((_, k) => {
      const n = netOf.get(`${p.id}.${pins[k]}`)!;
      noise.set(n, (noise.get(n) ?? 0) + 16 * eps * law.slope * vScale);
    });
    law.currents.forEach((expected, k) => {
      if (expected === null) return;
      const t = tol.lawRelative * Math.abs(expected) + tol.lawAbsolute + rounding;
      const q = Math.abs(cur[k] - expected) / t;
      worstLaw = Math.max(worstLaw, q);
      if (!(q <= 1)) violations.push(`part ${p.id} pin ${pins[k]}: current ${cur[k]} A, its law gives ${expected} A`);
    });
    if (law.constraints.length) ideal.push(pins.map((pin) => netOf.get(`${p.id}.${pin}`)!));
    for (const [a, b, c] of law.constraints) {
      const err = v[a] - v[b] - c;
      if (Math.abs(err) > (tol.kvlRelative ?? 1e-12) * vScale + (tol.kvlAbsolute ?? 1e-15)) violations.push(`part ${p.id}: ideal link with ${err} V across it`);
    }
  }
  for (let pass = 0; pass < 4; pass++)
    for (const nets of ideal) {
      const m = Math.max(...nets.map((n) => noise.get(n) ?? 0));
      for (const n of nets) noise.set(n, m);
    }
  // the ground net's balance is minus the sum of all the others, so it inherits their tolerances
  const tolOf = (n: number) => tol.kclRelative * (big.get(n) ?? 0) + tol.kclAbsolute + (noise.get(n) ?? 0);
  let others = 0;
  for (const n of sum.keys()) if (n !== -1) others += tolOf(n);
  for (const [n, s] of sum) {
    const t = tolOf(n) + (n === -1 ? others : 0);
    const q = Math.abs(s) / t;
    worstKcl = Math.max(worstKcl, q);
    if (!(q <= 1)) violations.push(`KCL at net ${n === -1 ? '0' : `#${n}`}: currents sum to ${s} A (largest ${big.get(n)} A)`);
  }
  return { violations, worstKcl, worstLaw };
}
