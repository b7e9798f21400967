// A sweep result in the shape the plot, the CSV export and the stored session use: plain arrays,
// the swept quantity along x and, for a two-parameter sweep, one curve per value of the other.
import type { SweepTable } from '../../../../shared/analysis/sweep';

export interface SweepAxisData {
  key: string;
  unit: string;
  values: number[];
  scale: 'linear' | 'log';
}

export interface SweepData {
  /** the plot's x axis (the inner axis of a two-parameter sweep) */
  x: SweepAxisData;
  /** the family parameter of a two-parameter sweep (one curve per value) */
  family: SweepAxisData | null;
  /** output key → unit, for every column the sweep recorded */
  units: Record<string, string>;
  /** output key → one array per family value (one array for a single sweep), NaN at failed points */
  curves: Record<string, number[][]>;
  failedPoints: number;
  /** the first failures, to explain them */
  errors: string[];
}

/**
 * Reshape a table from runSweep. `scales` gives each axis' spacing (for the plot). A two-axis
 * table is [family (outer), x (inner)].
 */
export function sweepDataFrom(t: SweepTable, scales: ReadonlyArray<'linear' | 'log'>): SweepData {
  const two = t.axes.length === 2;
  const xAxis = two ? t.axes[1] : t.axes[0];
  const famAxis = two ? t.axes[0] : null;
  const nx = xAxis.values.length;
  const nf = famAxis ? famAxis.values.length : 1;
  const curves: Record<string, number[][]> = {};
  for (const [key, col] of Object.entries(t.columns)) {
    const rows: number[][] = [];
    for (let f = 0; f < nf; f++) rows.push(Array.from(col.subarray(f * nx, (f + 1) * nx)));
    curves[key] = rows;
  }
  return {
    x: { key: xAxis.key, unit: xAxis.unit, values: [...xAxis.values], scale: scales[two ? 1 : 0] ?? 'linear' },
    family: famAxis ? { key: famAxis.key, unit: famAxis.unit, values: [...famAxis.values], scale: scales[0] ?? 'linear' } : null,
    units: { ...t.units },
    curves,
    failedPoints: t.errors.length,
    errors: t.errors.slice(0, 5).map((e) => `at ${e.at.map((v) => Number(v.toPrecision(4))).join(', ')}: ${e.message}`),
  };
}

/** One plotted series: an output at one family value. */
export interface CurveRef {
  output: string;
  family: number;
  label: string;
}

export function curveLabel(output: string, data: SweepData, f: number, fmt: (v: number, unit: string) => string): string {
  return data.family ? `${output} @ ${data.family.key} = ${fmt(data.family.values[f], data.family.unit)}` : output;
}
