// Sweep results as CSV (RFC 4180 through papaparse): one row per point, the swept quantities
// first, then the chosen outputs in SI units with the unit in the header.
import Papa from 'papaparse';
import type { SweepData } from './sweepData';

const header = (key: string, unit: string) => (unit ? `${key} [${unit}]` : key);

/** CSV text of `outputs` (keys such as "V(tap)") over the sweep; NaN (a failed point) is left empty. */
export function sweepCsv(data: SweepData, outputs: readonly string[]): string {
  const cols = [
    ...(data.family ? [header(data.family.key, data.family.unit)] : []),
    header(data.x.key, data.x.unit),
    ...outputs.map((o) => header(o, data.units[o] ?? '')),
  ];
  const rows: Array<Array<string | number>> = [];
  const nf = data.family ? data.family.values.length : 1;
  for (let f = 0; f < nf; f++)
    data.x.values.forEach((x, i) => {
      const cells: Array<string | number> = data.family ? [data.family.values[f]] : [];
      cells.push(x);
      for (const o of outputs) {
        const v = data.curves[o]?.[f]?.[i];
        cells.push(v === undefined || !Number.isFinite(v) ? '' : v);
      }
      rows.push(cells);
    });
  return Papa.unparse({ fields: cols, data: rows }, { newline: '\r\n' });
}
