// Preferred-value tools (shared/design, shared/units): value finder against a plain all-pairs
// search over the same parts, the divider designer, and value-field parsing throughput.
import { designDivider } from '../shared/design/divider-designer';
import { findValue } from '../shared/design/value-finder';
import { preferredValuesBetween, type ESeriesName } from '../shared/units/eseries';
import { formatRkm } from '../shared/units/rkm';
import { parseValue } from '../shared/units/parse-value';
import { fmtMs, medianMs, printTable } from './analysis-timing';

function allPairs(values: readonly number[], target: number): number {
  let best = Infinity;
  for (const a of values) for (const b of values) best = Math.min(best, Math.abs(a + b - target), Math.abs((a * b) / (a + b) - target));
  return best;
}

export async function run(): Promise<void> {
  const rows: Array<Record<string, string | number>> = [];
  for (const series of ['E24', 'E96', 'E192'] as ESeriesName[]) {
    const values = preferredValuesBetween(series, 1e-3, 1e12);
    const pairs = medianMs(() => findValue(12345, { series, maxParts: 2 }), { reps: 20 });
    const triples = medianMs(() => findValue(12345, { series, maxParts: 3 }), { reps: 5, budgetMs: 10000 });
    const brute = series === 'E192' ? null : medianMs(() => allPairs(values, 12345), { warmup: 1, reps: 3, budgetMs: 10000 });
    rows.push({ series, parts: values.length, 'pairs (windowed)': fmtMs(pairs), 'pairs (all-pairs loop)': fmtMs(brute), 'up to 3 parts': fmtMs(triples) });
  }
  printTable(rows);

  console.log('');
  const designs: Array<Record<string, string | number>> = [];
  const specs = [
    { name: 'E24, singles, no load', partsPerLeg: 1 as const, series: 'E24' as const },
    { name: 'E96, singles, 100k load', partsPerLeg: 1 as const, series: 'E96' as const, load: { kind: 'resistance' as const, ohms: 1e5 } },
    { name: 'E96, pairs per leg', partsPerLeg: 2 as const, series: 'E96' as const },
  ];
  for (const s of specs) {
    const spec = { supply: { min: 10.8, max: 13.2 }, target: 3.3, budget: { maxQuiescentCurrent: 1e-4 }, tolerance: 0.01, ...s };
    const r = designDivider(spec);
    designs.push({ divider: s.name, considered: r.ok ? r.considered : 0, time: fmtMs(medianMs(() => designDivider(spec), { reps: 10 })) });
  }
  printTable(designs);

  const inputs = preferredValuesBetween('E96', 0.1, 1e7).flatMap((v) => [formatRkm(v), `${v} Ω`, formatRkm(v, { style: 'lower' })]);
  const ms = medianMs(() => inputs.forEach((t) => parseValue(t, { unit: 'Ω' })), { reps: 10 });
  console.log(`\nparseValue: ${inputs.length} E96 strings in ${fmtMs(ms)} (${fmtMs(ms / inputs.length)} each)`);
}
