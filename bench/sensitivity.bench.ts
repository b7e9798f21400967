// Adjoint sensitivities (CompiledCircuit.sensitivities) against the finite differences they replace
// (two warm-started solves per param): the 30-part demo sheet of bench/analysis-sheets.ts and a
// 400-part resistor–diode ladder (sparse LU). Figures only; no target is asserted.
import { compileCircuit, type CompiledCircuit, type SensitivityOutput } from '../shared/engine';
import { fourZoneIndicator } from './analysis-sheets';

function ladder(stages: number): Record<string, unknown> {
  const parts: Array<Record<string, unknown>> = [{ id: 'V1', type: 'dc_voltage_source', params: { voltage: 10 } }, { id: 'G', type: 'ground' }, { id: 'L', type: 'net_label', params: { name: 'end' } }];
  const wires: Array<{ from: string; to: string }> = [{ from: 'V1.neg', to: 'G.g' }];
  let prev = 'V1.pos';
  for (let i = 0; i < stages; i++) {
    parts.push({ id: `R${i}`, type: 'resistor', params: { resistance: 10 + i } }, { id: `D${i}`, type: 'diode' });
    wires.push({ from: prev, to: `R${i}.a` }, { from: `R${i}.b`, to: `D${i}.anode` }, { from: `D${i}.cathode`, to: 'G.g' });
    prev = `R${i}.b`;
  }
  wires.push({ from: prev, to: 'L.n' });
  return { format: 'tapline.sheet', version: 1, parts, wires };
}

function timeMs(f: () => void, reps: number): number {
  f();
  const t0 = performance.now();
  for (let i = 0; i < reps; i++) f();
  return (performance.now() - t0) / reps;
}

function measure(name: string, c: CompiledCircuit, out: SensitivityOutput, reps: number): void {
  c.solveRaw();
  const params = c.sensitivities(out).entries;
  const adjoint = timeMs(() => c.sensitivities(out), reps);
  const fd = timeMs(() => {
    for (const e of params) {
      const h = e.value * 1e-4;
      c.solveRaw({ paramOverrides: { [e.part]: { [e.param]: e.value + h } }, initialGuess: 'previous' });
      c.solveRaw({ paramOverrides: { [e.part]: { [e.param]: e.value - h } }, initialGuess: 'previous' });
    }
    c.solveRaw();
  }, Math.max(1, Math.round(reps / 5)));
  console.log(`${name.padEnd(34)} ${String(params.length).padStart(6)} ${adjoint.toFixed(2).padStart(12)} ${fd.toFixed(2).padStart(14)} ${(fd / adjoint).toFixed(1).padStart(8)}×`);
}

export async function run(): Promise<void> {
  console.log(`${'sheet'.padEnd(34)} ${'params'.padStart(6)} ${'adjoint ms'.padStart(12)} ${'2×FD solves ms'.padStart(14)} ${'ratio'.padStart(9)}`);
  const demo = compileCircuit(fourZoneIndicator());
  demo.solveRaw();
  measure('four-zone indicator (30 parts)', demo, { kind: 'net', net: demo.netNames.find((n) => n !== '0')! }, 50);
  measure('diode ladder, 200 stages (sparse)', compileCircuit(ladder(200)), { kind: 'net', net: 'end' }, 5);
}
