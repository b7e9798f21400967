// The sweep plot's data: uPlot wants every series on one shared, ascending x array, so simulated
// x values and measured x values are merged, and each series has nulls where it has no point.
import type uPlot from 'uplot';
import type { SweepData } from './sweepData';
import type { BenchMapping, BenchTable } from './benchData';

export interface PlotSeries {
  label: string;
  unit: string;
  /** index into the palette */
  color: number;
  kind: 'simulated' | 'measured';
  output: string;
}

export interface SweepPlotModel {
  data: uPlot.AlignedData;
  series: PlotSeries[];
  /** the units on the left and (if a second one) right axes */
  units: string[];
  /** measured points lying outside the simulated x range (not drawn) */
  outside: number;
}

/** Measured (x, y) pairs of one mapped column, finite only. */
export function measuredPairs(t: BenchTable, mapping: BenchMapping, column: number): { x: number[]; y: number[] } {
  const xs = t.values[mapping.xColumn] ?? [];
  const ys = t.values[column] ?? [];
  const x: number[] = [];
  const y: number[] = [];
  for (let i = 0; i < xs.length; i++)
    if (Number.isFinite(xs[i]) && Number.isFinite(ys[i])) {
      x.push(xs[i]);
      y.push(ys[i]);
    }
  return { x, y };
}

export function buildSweepPlot(d: SweepData, outputs: readonly string[], bench: { table: BenchTable; mapping: BenchMapping } | null, familyLabel: (f: number) => string): SweepPlotModel {
  const units = [...new Set(outputs.map((o) => d.units[o] ?? ''))].slice(0, 2);
  const shown = outputs.filter((o) => units.includes(d.units[o] ?? '') && d.curves[o]);
  const lo = Math.min(d.x.values[0], d.x.values[d.x.values.length - 1]);
  const hi = Math.max(d.x.values[0], d.x.values[d.x.values.length - 1]);
  const measured: Array<{ output: string; x: number[]; y: number[]; label: string }> = [];
  let outside = 0;
  if (bench)
    for (const [col, output] of Object.entries(bench.mapping.yColumns)) {
      if (!shown.includes(output)) continue;
      const p = measuredPairs(bench.table, bench.mapping, Number(col));
      const keep = p.x.map((x) => x >= lo && x <= hi);
      outside += keep.filter((k) => !k).length;
      measured.push({ output, x: p.x.filter((_, i) => keep[i]), y: p.y.filter((_, i) => keep[i]), label: `${bench.table.columns[Number(col)]} (measured)` });
    }
  // merged ascending x
  const xs = [...new Set([...d.x.values, ...measured.flatMap((m) => m.x)])].sort((a, b) => a - b);
  const at = new Map(xs.map((x, i) => [x, i] as const));
  const series: PlotSeries[] = [];
  const columns: Array<Array<number | null>> = [];
  const nf = d.family ? d.family.values.length : 1;
  let color = 0;
  for (const o of shown) {
    for (let f = 0; f < nf; f++) {
      const col = new Array<number | null>(xs.length).fill(null);
      d.x.values.forEach((x, i) => {
        const v = d.curves[o][f][i];
        col[at.get(x)!] = Number.isFinite(v) ? v : null;
      });
      columns.push(col);
      series.push({ label: d.family ? `${o} @ ${familyLabel(f)}` : o, unit: d.units[o] ?? '', color: color++, kind: 'simulated', output: o });
    }
  }
  for (const m of measured) {
    const col = new Array<number | null>(xs.length).fill(null);
    m.x.forEach((x, i) => (col[at.get(x)!] = m.y[i]));
    columns.push(col);
    series.push({ label: m.label, unit: d.units[m.output] ?? '', color: color++, kind: 'measured', output: m.output });
  }
  return { data: [xs, ...columns] as uPlot.AlignedData, series, units, outside };
}
