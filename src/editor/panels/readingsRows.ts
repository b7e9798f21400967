// Rows of the readings table, in SI units, from a solve; also their CSV form.
import Papa from 'papaparse';
import { partSpecs } from '../../../shared/parts/specs';
import type { Sheet } from '../../../shared/sheet';
import type { SolveSuccess } from '../solve/resultTypes';

export interface NetRow {
  net: string;
  /** V */
  voltage: number;
  pins: string;
}

export interface PartRow {
  part: string;
  type: string;
  /** A, magnitude of the current through the part (collector current for transistors) */
  current: number;
  /** W absorbed (negative: delivered) */
  power: number;
  /** power / rating, when the part has a rating */
  ratingUse: number | null;
}

export function netRows(result: SolveSuccess, pinNets: Record<string, string>): NetRow[] {
  const pinsOf = new Map<string, string[]>();
  for (const [pin, net] of Object.entries(pinNets)) (pinsOf.get(net) ?? pinsOf.set(net, []).get(net)!).push(pin);
  return Object.entries(result.nets).map(([net, voltage]) => ({ net, voltage, pins: (pinsOf.get(net) ?? []).join(' ') }));
}

export function partRows(result: SolveSuccess, sheet: Sheet): PartRow[] {
  return sheet.parts
    .filter((p) => p.type !== 'ground' && p.type !== 'net_label' && result.parts[p.id])
    .map((p) => {
      const r = result.parts[p.id];
      const pins = r.pinCurrents;
      const current = p.type === 'npn' || p.type === 'pnp' ? Math.abs(pins.c ?? 0) : Math.abs(Object.values(pins)[0] ?? 0);
      const rating = (p.params as { powerRating?: number }).powerRating;
      return { part: p.id, type: partSpecs[p.type].label, current, power: r.power, ratingUse: rating ? r.power / rating : null };
    });
}

/** CSV with SI units named in the header, one row per net or part. */
export function readingsCsv(kind: 'nets' | 'parts', rows: NetRow[] | PartRow[], separator = ','): string {
  const data: Array<Record<string, string | number>> =
    kind === 'nets'
      ? (rows as NetRow[]).map((r) => ({ net: r.net, voltage_V: r.voltage, pins: r.pins }))
      : (rows as PartRow[]).map((r) => ({ part: r.part, type: r.type, current_A: r.current, power_W: r.power, rating_use: r.ratingUse ?? '' }));
  return Papa.unparse(data, { delimiter: separator, newline: '\n' });
}
