// Showing and reading quantities in the tool panels, for any unit the catalogue uses.
import { formatEng, parseValue, type Unit } from '../../../shared/units';

const PARSER_UNITS: ReadonlySet<string> = new Set<Unit>(['Ω', 'V', 'A', 'W', 'lx', '°C']);

/** "3.243 V", "12 mA", "0.4" (dimensionless), "3950 K". */
export function fmtQ(value: number, unit: string, digits = 4): string {
  if (value === undefined || value === null || Number.isNaN(value)) return '—';
  if (PARSER_UNITS.has(unit)) return formatEng(value, unit as Unit, { digits });
  const s = formatEng(value, '', { digits });
  return unit ? `${s} ${unit}` : s;
}

/** Percent with sensible digits: "99.73 %". */
export function fmtPct(fraction: number, digits = 4): string {
  if (!Number.isFinite(fraction)) return '—';
  return `${Number((fraction * 100).toPrecision(digits))} %`;
}

export type QuantityRead = { ok: true; value: number } | { ok: false; message: string };

/** Read a typed value in `unit` ("4k7", "3.3 V", "-40", "0.25"); the message says what to write instead. */
export function readQuantity(text: string, unit: string, what: string): QuantityRead {
  const t = text.trim();
  if (!t) return { ok: false, message: `Enter ${what}.` };
  const known = PARSER_UNITS.has(unit);
  const body = !known && unit ? t.replace(new RegExp(`\\s*${unit.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')}$`), '') : t;
  const r = parseValue(body, known ? { unit: unit as Unit, allowNegative: unit === 'V' || unit === 'A' || unit === '°C' } : { allowNegative: true });
  if (!r.ok) return { ok: false, message: `${what}: ${r.message}` };
  return { ok: true, value: r.value };
}

/** A number as a field starts with: engineering form without the unit ("4.7k", "0.5"). */
export function fieldText(value: number): string {
  return formatEng(value, '', { digits: 4 });
}
