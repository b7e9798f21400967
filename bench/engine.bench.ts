// Operating-point solve time for the example sheets and for square resistor grids (10×10, 30×30,
// 100×100 nodes), per linear solver. "compile" is parse + net extraction + topology checks +
// device set-up; "first solve" includes the first factorisation (ordering for band/sparse);
// "re-solve" is a later solve with a param override and a warm start (what a sweep point or a
// Monte Carlo sample costs).
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { compileCircuit, type SolveOptions } from '../shared/engine';

type Solver = NonNullable<SolveOptions['linearSolver']>;

function grid(n: number) {
  const parts: Array<Record<string, unknown>> = [
    { id: 'V1', type: 'dc_voltage_source', params: { voltage: 1 } },
    { id: 'GND', type: 'ground' },
  ];
  const wires: Array<{ from: string; to: string }> = [];
  const rep = new Map<string, string>(); // node → first pin on it
  const attach = (node: string, pin: string) => {
    const r = rep.get(node);
    if (r) wires.push({ from: r, to: pin });
    else rep.set(node, pin);
  };
  let k = 0;
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      if (j + 1 < n) {
        const id = `R${++k}`;
        parts.push({ id, type: 'resistor', params: { resistance: 1000 } });
        attach(`${i},${j}`, `${id}.a`);
        attach(`${i},${j + 1}`, `${id}.b`);
      }
      if (i + 1 < n) {
        const id = `R${++k}`;
        parts.push({ id, type: 'resistor', params: { resistance: 1000 } });
        attach(`${i},${j}`, `${id}.a`);
        attach(`${i + 1},${j}`, `${id}.b`);
      }
    }
  attach('0,0', 'V1.pos');
  attach(`${n - 1},${n - 1}`, 'GND.g');
  wires.push({ from: 'V1.neg', to: 'GND.g' });
  return { format: 'tapline.sheet', version: 1, title: `${n}×${n} resistor grid`, parts, wires };
}

function timeMs(f: () => void): number {
  const t = performance.now();
  f();
  return performance.now() - t;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

const fmt = (ms: number) => (ms < 1 ? `${(ms * 1000).toFixed(0)} µs` : ms < 1000 ? `${ms.toFixed(2)} ms` : `${(ms / 1000).toFixed(2)} s`);

interface Row {
  sheet: string;
  solver: string;
  unknowns: number | string;
  compile: string;
  'first solve': string;
  're-solve': string;
  iterations: number | string;
}

function measure(name: string, sheet: unknown, solver: Solver, reps: number, overridePart: string | null): Row {
  let compiled = compileCircuit(sheet, { linearSolver: solver });
  const compileTimes = [timeMs(() => (compiled = compileCircuit(sheet, { linearSolver: solver })))];
  for (let i = 1; i < reps; i++) compileTimes.push(timeMs(() => (compiled = compileCircuit(sheet, { linearSolver: solver }))));
  let iterations: number | string = '';
  let okAll = true;
  const first = timeMs(() => {
    const r = compiled.solve();
    okAll = r.ok;
    iterations = r.ok ? r.iterations : r.error.code;
  });
  const again: number[] = [];
  for (let i = 0; i < reps; i++) {
    const ov = overridePart ? { [overridePart]: { resistance: 1000 * (1 + 0.001 * (i + 1)) } } : undefined;
    again.push(timeMs(() => compiled.solve({ ...(ov ? { paramOverrides: ov } : {}), initialGuess: 'previous' })));
  }
  return {
    sheet: name,
    solver: compiled.linearSolverName || String(solver),
    unknowns: compiled.unknowns,
    compile: fmt(median(compileTimes)),
    'first solve': okAll ? fmt(first) : 'failed',
    're-solve': fmt(median(again)),
    iterations,
  };
}

export async function run(): Promise<void> {
  const rows: Row[] = [];
  const dir = path.resolve(import.meta.dirname, '../examples');
  for (const f of readdirSync(dir).filter((x) => x.endsWith('.json')).sort()) {
    const sheet = JSON.parse(readFileSync(path.join(dir, f), 'utf8'));
    const firstResistor = (sheet.parts as Array<{ id: string; type: string }>).find((p) => p.type === 'resistor')?.id ?? null;
    rows.push(measure(f, sheet, 'auto', 50, firstResistor));
  }
  for (const n of [10, 30, 100]) {
    const sheet = grid(n);
    const solvers: Solver[] = n <= 30 ? ['dense', 'band', 'sparse'] : ['band', 'sparse'];
    for (const s of solvers) rows.push(measure(`grid ${n}×${n} (${n * n} nodes)`, sheet, s, n === 100 ? 3 : 10, 'R1'));
    if (n === 100)
      rows.push({ sheet: `grid ${n}×${n} (${n * n} nodes)`, solver: 'dense-lu (ml-matrix)', unknowns: n * n, compile: '', 'first solve': 'skipped: dense (10⁴×10⁴)', 're-solve': '', iterations: '' });
  }
  console.log('Operating-point solve time (median; see bench/engine.bench.ts for what each column covers)');
  console.log(textTable(rows as unknown as Array<Record<string, string | number>>));
}

function textTable(rows: Array<Record<string, string | number>>): string {
  const cols = Object.keys(rows[0] ?? {});
  const cell = (r: Record<string, string | number>, c: string) => String(r[c] ?? '');
  const width = cols.map((c) => Math.max(c.length, ...rows.map((r) => cell(r, c).length)));
  const line = (vals: string[]) => vals.map((v, i) => (i === 0 ? v.padEnd(width[i]) : v.padStart(width[i]))).join('  ');
  return [line(cols), width.map((w) => '-'.repeat(w)).join('  '), ...rows.map((r) => line(cols.map((c) => cell(r, c))))].join('\n');
}

if (import.meta.url === `file://${process.argv[1]}`) void run();
