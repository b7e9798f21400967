// Turn the tolerance form into the analyses' options, reading the typed spec windows.
import { parseOutputKey, type OutputSpec } from '../../../../shared/analysis/outputs';
import type { MonteCarloOptions } from '../../../../shared/analysis/monte-carlo';
import type { WorstCaseOptions } from '../../../../shared/analysis/worst-case';
import type { SpecWindow } from '../../../../shared/analysis/statistics';
import { readQuantity } from '../format';
import type { ToleranceForm } from '../results/toolSession';

export type ToleranceRequest =
  | { ok: true; worstCase: WorstCaseOptions; monteCarlo: MonteCarloOptions }
  | { ok: false; message: string };

const unitOf = (o: OutputSpec) => (o.kind === 'net' ? 'V' : o.kind === 'current' ? 'A' : 'W');

/** Options for both runs, or what to fix in the form. */
export function toleranceRequest(f: ToleranceForm): ToleranceRequest {
  if (!f.outputs.length) return { ok: false, message: 'Choose at least one output.' };
  if (!(Number.isInteger(f.samples) && f.samples >= 10 && f.samples <= 2_000_000)) return { ok: false, message: 'Samples: use a whole number from 10 to 2,000,000.' };
  if (!Number.isInteger(f.seed)) return { ok: false, message: 'Seed: use a whole number (the same seed repeats the same run).' };
  const outputs: OutputSpec[] = [];
  const windows: Record<string, SpecWindow> = {};
  for (const key of f.outputs) {
    const spec = parseOutputKey(key);
    if (!spec) return { ok: false, message: `Output ${key} is not one Tapline can measure.` };
    outputs.push(spec);
    const w = f.windows[key];
    const win: SpecWindow = {};
    for (const side of ['min', 'max'] as const) {
      const text = w?.[side]?.trim();
      if (!text) continue;
      const r = readQuantity(text, unitOf(spec), `${key} ${side === 'min' ? 'lower' : 'upper'} limit`);
      if (!r.ok) return { ok: false, message: r.message };
      win[side] = r.value;
    }
    if (win.min !== undefined && win.max !== undefined && win.min > win.max)
      return { ok: false, message: `${key}: the lower limit is above the upper limit; swap them.` };
    if (win.min !== undefined || win.max !== undefined) windows[key] = win;
  }
  const common = { outputs, supplyRange: f.supplyRange };
  return {
    ok: true,
    worstCase: common,
    monteCarlo: { ...common, samples: f.samples, seed: f.seed, distribution: f.distribution, windows, histogramBins: 40 },
  };
}
