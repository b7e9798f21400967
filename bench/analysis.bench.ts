// Speed targets of the analyses (issue 4), measured on this machine and printed with the target
// and whether it was met. Medians are after warm-up; the grid rows are also shown cold (first run
// in this process, as a user's first solve would be). Memory: heap + ArrayBuffer growth over the
// run (typed arrays of the sparse LU live in ArrayBuffers).
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { prepareCircuit, runMonteCarlo, runSweep, runWorstCase } from '../shared/analysis';
import { compileCircuit, solveOperatingPoint } from '../shared/engine';
import { fourZoneIndicator, resistorGrid } from './analysis-sheets';
import { fmtMs, medianMs, onceMs, printTable } from './analysis-timing';

type Row = Record<string, string | number>;

function memMiB(): number {
  (globalThis as { gc?: () => void }).gc?.();
  const m = process.memoryUsage();
  return (m.heapUsed + m.arrayBuffers) / 2 ** 20;
}

function verdict(ms: number, target: number): string {
  return ms <= target ? 'met' : `MISSED (×${(ms / target).toFixed(1)})`;
}

export async function run(): Promise<void> {
  const rows: Row[] = [];
  const dir = path.resolve(import.meta.dirname, '../examples');
  for (const f of readdirSync(dir).filter((x) => x.endsWith('.json')).sort()) {
    const sheet = JSON.parse(readFileSync(path.join(dir, f), 'utf8'));
    const whole = medianMs(() => void solveOperatingPoint(sheet), { warmup: 20, reps: 101 });
    const compiled = compileCircuit(sheet);
    const solveOnly = medianMs(() => void compiled.solve(), { warmup: 20, reps: 101 });
    rows.push({ task: `operating point, ${f}`, 'median (parse+compile+solve)': fmtMs(whole), 'median (solve only)': fmtMs(solveOnly), target: '< 1 ms', verdict: verdict(whole, 1), memory: '' });
  }

  // 1,000-point potentiometer sweep of a non-linear example
  const ldr = JSON.parse(readFileSync(path.join(dir, 'ldr-night-light.json'), 'utf8'));
  const pLdr = prepareCircuit(ldr);
  const sweepSpec = { axes: [{ target: { kind: 'param' as const, part: 'RV1', param: 'position' }, steps: { from: 0, to: 1, points: 1000 } }] } as const;
  let sweepErrors = 0;
  const sweepMs = medianMs(() => void (sweepErrors = runSweep(pLdr, sweepSpec).errors.length), { warmup: 2, reps: 9, budgetMs: 10000 });
  rows.push({ task: '1,000-point pot sweep, ldr-night-light (NPN + LED)', 'median (parse+compile+solve)': '', 'median (solve only)': fmtMs(sweepMs), target: '< 100 ms', verdict: verdict(sweepMs, 100), memory: `${sweepErrors} point(s) failed` });

  // Monte Carlo, 30-part non-linear sheet, one core
  const zones = prepareCircuit(fourZoneIndicator());
  const mcOpts = { outputs: [{ kind: 'current' as const, part: 'D1', pin: 'anode' }, { kind: 'current' as const, part: 'D4', pin: 'anode' }], samples: 10_000, seed: 1 };
  runMonteCarlo(zones, { ...mcOpts, samples: 500 });
  const m0 = memMiB();
  let failed = 0;
  const mcMs = onceMs(() => void (failed = runMonteCarlo(zones, mcOpts).failed));
  rows.push({ task: `Monte Carlo 10,000 samples, 30-part sheet (${zones.compiled.unknowns} unknowns, 21 toleranced params)`, 'median (parse+compile+solve)': '', 'median (solve only)': fmtMs(mcMs), target: '< 2 s', verdict: verdict(mcMs, 2000), memory: `${(memMiB() - m0).toFixed(1)} MiB; ${failed} failed` });

  // worst case of the same sheet (for reference)
  const wcMs = medianMs(() => void runWorstCase(zones, { outputs: mcOpts.outputs }), { warmup: 1, reps: 3, budgetMs: 20000 });
  rows.push({ task: 'worst case, same 30-part sheet (21 params: sensitivities + vertex search)', 'median (parse+compile+solve)': '', 'median (solve only)': fmtMs(wcMs), target: '—', verdict: '', memory: '' });

  // resistor grids through the engine with the sparse LU
  for (const [k, target] of [[100, 500], [300, 10000]] as const) {
    const sheet = resistorGrid(k);
    const m1 = memMiB();
    let unknowns = 0;
    let ok = false;
    const cold = onceMs(() => {
      const c = compileCircuit(sheet, { linearSolver: 'sparse' });
      unknowns = c.unknowns;
      ok = c.solve().ok;
    });
    const mem = memMiB() - m1;
    const warm = k === 100 ? medianMs(() => void compileCircuit(sheet, { linearSolver: 'sparse' }).solve(), { warmup: 1, reps: 5, budgetMs: 15000 }) : NaN;
    rows.push({
      task: `${k}×${k} resistor grid (${unknowns} unknowns), compile + solve`,
      'median (parse+compile+solve)': k === 100 ? `${fmtMs(warm)} (cold ${fmtMs(cold)})` : `cold ${fmtMs(cold)}`,
      'median (solve only)': '',
      target: `< ${target >= 1000 ? `${target / 1000} s` : `${target} ms`}`,
      verdict: ok ? verdict(k === 100 ? warm : cold, target) : 'FAILED to solve',
      memory: `+${mem.toFixed(0)} MiB`,
    });
  }
  console.log('Analysis speed targets (2-core machine; shared with other work, so figures vary by ±30 %)');
  printTable(rows);
}
