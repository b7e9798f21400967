/**
 * Parts list (bill of materials) of a sheet: one row per distinct part — same type, value,
 * tolerance and rating — with its designators and quantity.
 *
 * Sources, loads, grounds and net labels are left out: they stand for the world around the
 * circuit (a bench supply, the ADC input), not for parts to buy. Settings that change while the
 * circuit runs (a potentiometer's wiper position, a switch's state) and per-part operating
 * conditions (temperature, illuminance) do not split rows.
 */
import { PART_TYPES, partSpecs, type PartType } from '../parts/specs';
import type { Part, Sheet } from '../sheet/schema';
import { formatEng } from '../units/engineering';
import { formatRkm } from '../units/rkm';

export interface PartsListRow {
  /** Designators (part ids) in natural order: R1, R2, R10. */
  readonly designators: readonly string[];
  readonly type: PartType;
  /** The catalogue's name for the type, e.g. "Resistor". */
  readonly typeLabel: string;
  /** The value in engineering notation ("4.7 kΩ"), or the figures that define the part ("5.1 V at 5 mA"). */
  readonly value: string;
  /** The value as an RKM code ("4K7") for parts sold by resistance, else null. */
  readonly valueRkm: string | null;
  /** Tolerance as a fraction (0.01 = ±1 %), where the part has one. */
  readonly tolerance: number | null;
  /** Rated dissipation, W, where the part has one. */
  readonly powerRating: number | null;
  readonly quantity: number;
}

const NOT_BOUGHT: ReadonlySet<PartType> = new Set<PartType>(['dc_voltage_source', 'dc_current_source', 'load', 'ground', 'net_label']);
const NOT_IDENTITY: ReadonlySet<string> = new Set(['position', 'closed', 'temperatureC', 'illuminanceLux']);

const num = (x: unknown) => (typeof x === 'number' ? x : NaN);
const plain = (x: number) => String(Number(x.toPrecision(4)));

function describe(part: Part): { value: string; rkm: string | null } {
  const p = part.params as Record<string, unknown>;
  switch (part.type) {
    case 'resistor': {
      // Rows split on tempco, so show it when it is set.
      const tempco = num(p.tempco) ? `, ${plain(num(p.tempco))} ppm/K` : '';
      return { value: `${formatEng(num(p.resistance), 'Ω')}${tempco}`, rkm: formatRkm(num(p.resistance)) };
    }
    case 'potentiometer':
      return { value: `${formatEng(num(p.resistance), 'Ω')} ${String(p.taper)}`, rkm: formatRkm(num(p.resistance)) };
    case 'ntc': {
      const curve = p.steinhartHart ? 'Steinhart–Hart' : `B ${plain(num(p.beta))} K`;
      return { value: `${formatEng(num(p.nominalResistance), 'Ω')} at ${plain(num(p.nominalTemperatureC))} °C, ${curve}`, rkm: formatRkm(num(p.nominalResistance)) };
    }
    case 'ldr':
      return { value: `${formatEng(num(p.resistanceAt10Lux), 'Ω')} at 10 lx, γ ${plain(num(p.gamma))}`, rkm: formatRkm(num(p.resistanceAt10Lux)) };
    case 'zener':
      return { value: `${formatEng(num(p.zenerVoltage), 'V')} at ${formatEng(num(p.testCurrent), 'A')}`, rkm: null };
    case 'led':
      return { value: `${formatEng(num(p.forwardVoltage), 'V')} at ${formatEng(num(p.testCurrent), 'A')}, max ${formatEng(num(p.maxCurrent), 'A')}`, rkm: null };
    case 'diode': {
      const breakdown = typeof p.breakdownVoltage === 'number' ? `, breakdown ${formatEng(p.breakdownVoltage, 'V')}` : '';
      return { value: `I_S ${formatEng(num(p.saturationCurrent), 'A')}, n ${plain(num(p.emissionCoefficient))}${breakdown}`, rkm: null };
    }
    case 'npn':
    case 'pnp':
      return { value: `β ${plain(num(p.beta))}`, rkm: null };
    case 'switch':
      return { value: `on ${formatEng(num(p.onResistance), 'Ω')}`, rkm: null };
    default:
      return { value: '', rkm: null };
  }
}

// The identity of a part to buy: its type and every parameter except run-time settings.
function identity(part: Part): string {
  const p = part.params as Record<string, unknown>;
  const kept = Object.keys(p)
    .filter((k) => !NOT_IDENTITY.has(k) && p[k] !== undefined)
    .sort()
    .map((k) => [k, p[k]]);
  return `${part.type}:${JSON.stringify(kept)}`;
}

/** Orders designators as people read them: R2 before R10, then by prefix. */
export function compareDesignators(a: string, b: string): number {
  return a.localeCompare(b, 'en', { numeric: true, sensitivity: 'base' });
}

/** The parts list of `sheet`, grouped by identical parts, in palette order of type then designator. */
export function partsList(sheet: Pick<Sheet, 'parts'>): PartsListRow[] {
  const groups = new Map<string, Part[]>();
  for (const part of sheet.parts) {
    if (NOT_BOUGHT.has(part.type)) continue;
    const key = identity(part);
    const group = groups.get(key);
    if (group) group.push(part);
    else groups.set(key, [part]);
  }
  const rows: PartsListRow[] = [...groups.values()].map((group) => {
    const first = group[0];
    const p = first.params as Record<string, unknown>;
    const { value, rkm } = describe(first);
    return {
      designators: group.map((g) => g.id).sort(compareDesignators),
      type: first.type,
      typeLabel: partSpecs[first.type].label,
      value,
      valueRkm: rkm,
      tolerance: typeof p.tolerance === 'number' ? p.tolerance : null,
      powerRating: typeof p.powerRating === 'number' ? p.powerRating : null,
      quantity: group.length,
    };
  });
  const order = (t: PartType) => PART_TYPES.indexOf(t);
  return rows.sort((x, y) => order(x.type) - order(y.type) || compareDesignators(x.designators[0], y.designators[0]));
}
