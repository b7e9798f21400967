// Thevenin equivalent against its definition (open-circuit voltage; source resistance = V_oc/I_sc
// with I_sc the current of a short from the net to ground, measured here with a 0 V source placed
// on an edited sheet) and, for the divider, against R_th = R₁∥R₂ and the loaded tap
// V = V_th·R_L/(R_th + R_L) (shared/references.md, "Divider tolerance and loading").
import { describe, expect, it } from 'vitest';
import { powerBudget, prepareCircuit, solveOrThrow, theveninAt } from '../../../shared/analysis';
import { solveOperatingPoint } from '../../../shared/engine';
import type { SheetInput } from '../../../shared/sheet/schema';
import zenerReference from '../../../examples/zener-reference.json';
import { bridge, divider } from './fixtures';

function shortCircuitCurrent(sheet: SheetInput, net: string, pin: string): number {
  const s = structuredClone(sheet);
  s.parts!.push({ id: 'VSHORT', type: 'dc_voltage_source', params: { voltage: 0 } }, { id: 'GSHORT', type: 'ground' });
  s.wires!.push({ from: 'VSHORT.pos', to: pin }, { from: 'VSHORT.neg', to: 'GSHORT.g' });
  const r = solveOperatingPoint(s);
  if (!r.ok) throw new Error(r.error.message);
  void net;
  // current INTO the 0 V source's + pin = the current the short takes from the net
  return r.parts.VSHORT.pinCurrents.pos;
}

describe('Thevenin equivalent', () => {
  it('of the divider tap is 12 V·10/37 behind 27 kΩ ∥ 10 kΩ', () => {
    const t = theveninAt(divider(), 'tap');
    expect(t.openCircuitVoltage).toBeCloseTo(3.24324324324, 10);
    expect(t.resistance).toBeCloseTo((27000 * 10000) / 37000, 6);
    expect(t.smallSignal).toBe(false);
    // it predicts the loaded tap exactly for a linear circuit
    const loaded = solveOperatingPoint(divider({ load: 4700 }));
    if (!loaded.ok) throw new Error(loaded.error.message);
    expect(loaded.nets.tap).toBeCloseTo((t.openCircuitVoltage * 4700) / (t.resistance + 4700), 10);
  });

  it('matches the open-circuit / short-circuit definition on a bridge with a current source', () => {
    const sheet = bridge();
    const t = theveninAt(sheet, 's');
    const isc = shortCircuitCurrent(sheet, 's', 'R5.b');
    expect(t.openCircuitVoltage / isc).toBeCloseTo(t.resistance, 6);
    expect(t.shortCircuitCurrent).toBeCloseTo(isc, 12);
  });

  it('is the small-signal resistance for a Zener reference: a small extra load confirms it', () => {
    const t = theveninAt(zenerReference, 'vref');
    expect(t.smallSignal).toBe(true);
    const rs = (zenerReference.parts.find((p) => p.id === 'R1')!.params as { resistance: number }).resistance;
    expect(t.resistance).toBeGreaterThan(0);
    expect(t.resistance).toBeLessThan(rs / 5); // the Zener's dynamic resistance dominates
    // definition of the incremental resistance: draw 10 µA more from the net on an edited sheet
    const s = structuredClone(zenerReference) as SheetInput;
    const pin = 'DZ1.cathode';
    s.parts!.push({ id: 'IX', type: 'load', params: { mode: 'current', value: 1e-5 } }, { id: 'GX', type: 'ground' });
    s.wires!.push({ from: 'IX.pos', to: pin }, { from: 'IX.neg', to: 'GX.g' });
    const r = solveOperatingPoint(s);
    if (!r.ok) throw new Error(r.error.message);
    expect((t.openCircuitVoltage - r.nets.vref) / 1e-5).toBeCloseTo(t.resistance, 1);
  });

  it('explains a net that does not exist', () => {
    expect(() => theveninAt(divider(), 'out')).toThrow(/no net "out".*tap/);
    expect(() => theveninAt(divider(), '0')).toThrow(/reference net/);
  });
});

describe('budgets', () => {
  it('divider feeding a load: supply current, dissipation, efficiency = P_load / P_source', () => {
    const sheet = divider({ load: 4700 });
    const p = prepareCircuit(sheet);
    const r = solveOrThrow(p);
    const b = powerBudget(p.sheet, r, { load: 'RL1', source: 'V1' });
    // closed form: R2 ∥ RL below R1
    const rp = (10000 * 4700) / 14700;
    const i = 12 / (27000 + rp);
    expect(b.totalSupplyCurrent).toBeCloseTo(i, 14);
    expect(b.supplies[0].power).toBeCloseTo(12 * i, 12);
    const vtap = i * rp;
    expect(b.efficiency!.efficiency).toBeCloseTo((vtap * vtap) / 4700 / (12 * i), 12);
    const r1 = b.stress.find((s) => s.part === 'R1')!;
    expect(r1.value).toBeCloseTo((12 - vtap) ** 2 / 27000, 12);
    expect(r1.rating).toBe(0.25);
    expect(r1.status).toBe('ok');
    // the branches: R1 carries the whole supply current, then R2 and the load share it
    expect(b.branches[0]).toMatchObject({ part: 'R1' });
    expect(b.branches[0].current).toBeCloseTo(i, 14);
    expect(b.branches.find((x) => x.part === 'RL1')!.current).toBeCloseTo(vtap / 4700, 14);
  });

  it('derates a resistor at a hot ambient', () => {
    const sheet = divider();
    const p = prepareCircuit(sheet);
    const r = solveOrThrow(p, { conditions: { temperatureC: 125 } });
    const r1 = powerBudget(p.sheet, r).stress.find((s) => s.part === 'R1')!;
    expect(r1.ambientC).toBe(125);
    expect(r1.deratedRating).toBeCloseTo(0.25 * (30 / 85), 12);
  });
});
