// The divider designer's form, as typed, and its reading into a DividerSpec.
import type { DividerSpec } from '../../../../shared/design';
import type { ESeriesName } from '../../../../shared/units';
import type { Sheet } from '../../../../shared/sheet';
import { fieldText, readQuantity } from '../format';

export interface DividerFormState {
  supply: string;
  supplyMin: string;
  supplyMax: string;
  target: string;
  loadKind: 'none' | 'resistance' | 'current';
  load: string;
  budgetKind: 'current' | 'total';
  budget: string;
  tolerancePct: string;
  series: ESeriesName;
  partsPerLeg: 1 | 2;
  powerRating: string;
}

/** A first form, with the supply taken from the sheet's first voltage source. */
export function initialDividerForm(sheet: Sheet): DividerFormState {
  const v = sheet.parts.find((p) => p.type === 'dc_voltage_source');
  const params = (v?.params ?? {}) as { voltage?: number; min?: number; max?: number };
  const nominal = params.voltage ?? 12;
  return {
    supply: fieldText(nominal),
    supplyMin: params.min !== undefined ? fieldText(params.min) : '',
    supplyMax: params.max !== undefined ? fieldText(params.max) : '',
    target: fieldText(Number((nominal / 4).toPrecision(2))),
    loadKind: 'none',
    load: '1M',
    budgetKind: 'current',
    budget: '100u',
    tolerancePct: '1',
    series: 'E24',
    partsPerLeg: 1,
    powerRating: '0.25',
  };
}

export type DividerRead = { ok: true; spec: DividerSpec; tolerance: number; powerRating: number } | { ok: false; message: string };

export function readDividerForm(f: DividerFormState): DividerRead {
  const fail = (message: string): DividerRead => ({ ok: false, message });
  const supply = readQuantity(f.supply, 'V', 'Supply');
  if (!supply.ok) return fail(supply.message);
  const lo = f.supplyMin.trim() ? readQuantity(f.supplyMin, 'V', 'Supply minimum') : null;
  const hi = f.supplyMax.trim() ? readQuantity(f.supplyMax, 'V', 'Supply maximum') : null;
  if (lo && !lo.ok) return fail(lo.message);
  if (hi && !hi.ok) return fail(hi.message);
  const target = readQuantity(f.target, 'V', 'Wanted output');
  if (!target.ok) return fail(target.message);
  const tol = Number(f.tolerancePct.replace('%', '').trim());
  if (!(tol >= 0 && tol < 100)) return fail('Tolerance: a percentage from 0 to below 100, e.g. 1 for ±1 %.');
  const pr = readQuantity(f.powerRating, 'W', 'Power rating');
  if (!pr.ok) return fail(pr.message);
  const budgetValue = readQuantity(f.budget, f.budgetKind === 'current' ? 'A' : 'Ω', f.budgetKind === 'current' ? 'Maximum divider current' : 'Total resistance');
  if (!budgetValue.ok) return fail(budgetValue.message);
  let load: DividerSpec['load'] = { kind: 'none' };
  if (f.loadKind !== 'none') {
    const l = readQuantity(f.load, f.loadKind === 'resistance' ? 'Ω' : 'A', 'Load');
    if (!l.ok) return fail(l.message);
    load = f.loadKind === 'resistance' ? { kind: 'resistance', ohms: l.value } : { kind: 'current', amps: l.value };
  }
  const ranged = lo?.ok || hi?.ok;
  const spec: DividerSpec = {
    supply: ranged ? { min: lo?.ok ? lo.value : supply.value, max: hi?.ok ? hi.value : supply.value, nominal: supply.value } : supply.value,
    target: target.value,
    load,
    budget: f.budgetKind === 'current' ? { maxQuiescentCurrent: budgetValue.value } : { totalResistance: budgetValue.value },
    tolerance: tol / 100,
    series: f.series,
    partsPerLeg: f.partsPerLeg,
    powerRating: pr.value,
    limit: 12,
  };
  return { ok: true, spec, tolerance: tol / 100, powerRating: pr.value };
}
