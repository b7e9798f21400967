// Bench measurements from a CSV file (papaparse): a header row, then one row per reading. Cells
// may be plain numbers or values with a prefix and unit ("4.7k", "3.3 V", "12 mA"), read with the
// same parser as every value field. Rows with an unreadable cell are skipped and counted.
import Papa from 'papaparse';
import { parseValue } from '../../../../shared/units';

export interface BenchTable {
  fileName: string;
  columns: string[];
  /** column → values (NaN where a cell is empty or unreadable) */
  values: number[][];
  rows: number;
  /** why rows or columns were skipped, for the user */
  notes: string[];
}

/** A number from a cell: plain JavaScript number syntax, else engineering/RKM notation. */
export function readCell(cell: string): number {
  const t = cell.trim();
  if (!t) return NaN;
  const n = Number(t);
  if (Number.isFinite(n)) return n;
  const p = parseValue(t, { allowNegative: true });
  return p.ok ? p.value : NaN;
}

/** Parse CSV text. @throws Error with what to fix when the file has no usable numeric column */
export function parseBenchCsv(text: string, fileName = 'measurements.csv'): BenchTable {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy', delimitersToGuess: [',', ';', '\t'] });
  const rows = parsed.data.filter((r) => r.some((c) => c.trim() !== ''));
  if (rows.length < 2) throw new Error(`${fileName}: expected a header row and at least one row of readings.`);
  const first = rows[0].map((c) => c.trim());
  // a first row that is all numbers is data, not a header
  const hasHeader = first.some((c) => c !== '' && !Number.isFinite(readCell(c)));
  const columns = hasHeader ? first.map((c, i) => c || `column ${i + 1}`) : first.map((_, i) => `column ${i + 1}`);
  const body = hasHeader ? rows.slice(1) : rows;
  const values = columns.map((_, j) => body.map((r) => readCell(r[j] ?? '')));
  const numeric = values.map((col) => col.some(Number.isFinite));
  if (numeric.filter(Boolean).length < 2)
    throw new Error(`${fileName}: need two columns of numbers (the swept value and a reading); found ${numeric.filter(Boolean).length}. Check the delimiter (comma, semicolon or tab) and that decimals use a point.`);
  const notes: string[] = [];
  const bad = body.filter((r) => r.some((c, j) => numeric[j] && c.trim() !== '' && !Number.isFinite(readCell(c)))).length;
  if (bad) notes.push(`${bad} row${bad === 1 ? '' : 's'} had a cell that is not a number; those readings are left out.`);
  if (parsed.errors.length) notes.push(`CSV: ${parsed.errors[0].message} (row ${(parsed.errors[0].row ?? 0) + 1}).`);
  return { fileName, columns, values, rows: body.length, notes };
}

/** Which column is x and which output each other column compares with (guessed from the headers). */
export interface BenchMapping {
  xColumn: number;
  /** column index → output key ("V(tap)") */
  yColumns: Record<number, string>;
}

const norm = (s: string) => s.toLowerCase().replace(/\s*\[.*?\]\s*/g, '').replace(/[^a-z0-9_().]/g, '');

/**
 * First guess: x is the column whose header names the swept key (else the first column); each other
 * column goes to the output it names ("V(tap)", "tap", "tap [V]"), else to the first plotted output.
 */
export function guessMapping(t: BenchTable, xKey: string, outputs: readonly string[]): BenchMapping {
  const numeric = t.values.map((c) => c.some(Number.isFinite));
  const xName = norm(xKey.replace(/^conditions\./, ''));
  let xColumn = t.columns.findIndex((c, i) => numeric[i] && (norm(c) === norm(xKey) || norm(c).includes(xName)));
  if (xColumn < 0) xColumn = numeric.indexOf(true);
  const yColumns: Record<number, string> = {};
  t.columns.forEach((c, i) => {
    if (i === xColumn || !numeric[i]) return;
    const n = norm(c);
    const hit = outputs.find((o) => norm(o) === n || norm(o.replace(/^V\((.*)\)$/, '$1')) === n);
    if (hit) yColumns[i] = hit;
  });
  if (!Object.keys(yColumns).length && outputs.length) {
    const firstY = numeric.findIndex((ok, i) => ok && i !== xColumn);
    if (firstY >= 0) yColumns[firstY] = outputs[0];
  }
  return { xColumn, yColumns };
}
