// Adjoint sensitivities (CompiledCircuit.sensitivities) against finite differences of full re-solves,
// and against the first-order divider sensitivity of shared/references.md (JCGM 100:2008 law of
// propagation; S = R1/(R1 + R2)).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compileCircuit, type CompiledCircuit, type SensitivityOutput } from '../../../shared/engine';
import { part, sheet, wire } from '../../support/reference/sheets';

function valueOf(c: CompiledCircuit, out: SensitivityOutput): number {
  if (out.kind === 'net') return c.netVoltage(out.net);
  if (out.kind === 'current') return c.pinCurrent(out.part, out.pin);
  return c.partPower(out.part);
}

/** dy/dp by central differences of two full solves, p·(1 ± δ), warm-started from the nominal point. */
// δ = 1e-4: the truncation error (≈ δ²) and the solves' own rounding divided by 2δ are both near 1e-8
// relative; smaller steps drown in the Newton solution's last digits.
function finiteDifference(c: CompiledCircuit, out: SensitivityOutput, partId: string, param: string, p: number, delta = 1e-4): number {
  const h = Math.abs(p) * delta || delta;
  const at = (v: number) => {
    const r = c.solveRaw({ paramOverrides: { [partId]: { [param]: v } }, initialGuess: 'previous' });
    if (!r.ok) throw new Error(r.error.message);
    return valueOf(c, out);
  };
  const up = at(p + h);
  const down = at(p - h);
  c.solveRaw();
  return (up - down) / (2 * h);
}

function expectMatchesFiniteDifferences(s: unknown, outputs: SensitivityOutput[], rel = 1e-4): void {
  const c = compileCircuit(s);
  for (const out of outputs) {
    expect(c.solveRaw().ok).toBe(true);
    const rep = c.sensitivities(out);
    expect(rep.entries.length).toBeGreaterThan(0);
    for (const e of rep.entries) {
      expect(e.derivative, `${e.part}.${e.param}: ${e.reason}`).not.toBeNull();
      const fd = finiteDifference(c, out, e.part, e.param, e.value);
      // a derivative that is 0 to rounding (a supply current against a collector resistor in the
      // forward-active region) is compared against the output's own scale
      const tol = rel * Math.abs(fd) + 1e-8 * Math.abs(rep.output / e.value);
      if (!(Math.abs(e.derivative! - fd) <= tol)) expect.fail(`${JSON.stringify(out)} w.r.t. ${e.part}.${e.param}: adjoint ${e.derivative}, finite difference ${fd}`);
    }
  }
}

const example = (name: string) => JSON.parse(readFileSync(new URL(`../../../examples/${name}`, import.meta.url), 'utf8'));

describe('adjoint sensitivities', () => {
  const divider = sheet(
    [part('V1', 'dc_voltage_source', { voltage: 12 }), part('R1', 'resistor', { resistance: 27000 }), part('R2', 'resistor', { resistance: 10000 }), part('L', 'net_label', { name: 'tap' }), part('G', 'ground')],
    [wire('V1.pos', 'R1.a'), wire('R1.b', 'R2.a'), wire('R2.a', 'L.n'), wire('R2.b', 'G.g'), wire('V1.neg', 'G.g')],
  );

  it('a divider: the closed forms, and the normalised sensitivities ±S of shared/references.md', () => {
    const c = compileCircuit(divider);
    c.solve();
    const rep = c.sensitivities({ kind: 'net', net: 'tap' });
    const by = Object.fromEntries(rep.entries.map((e) => [`${e.part}.${e.param}`, e]));
    const [V, R1, R2] = [12, 27000, 10000];
    // d/dR1 of V·R2/(R1 + R2) and d/dR2, d/dV (closed form)
    expect(Math.abs(by['R1.resistance'].derivative! / ((-V * R2) / (R1 + R2) ** 2) - 1)).toBeLessThan(1e-8);
    expect(Math.abs(by['R2.resistance'].derivative! / ((V * R1) / (R1 + R2) ** 2) - 1)).toBeLessThan(1e-8);
    expect(Math.abs(by['V1.voltage'].derivative! / (R2 / (R1 + R2)) - 1)).toBeLessThan(1e-8);
    // references.md: δV/V ≈ S·(δR2/R2 − δR1/R1), S = R1/(R1 + R2) = 0.7297…
    const S = R1 / (R1 + R2);
    expect(Math.abs(by['R2.resistance'].normalized! - S)).toBeLessThan(1e-8);
    expect(Math.abs(by['R1.resistance'].normalized! + S)).toBeLessThan(1e-8);
    expect(Math.abs(by['V1.voltage'].normalized! - 1)).toBeLessThan(1e-8);
  });

  it('currents and powers, including the direct dependence of a part on its own value', () => {
    expectMatchesFiniteDifferences(divider, [
      { kind: 'current', part: 'R2', pin: 'a' },
      { kind: 'current', part: 'R1', pin: 'b' },
      { kind: 'current', part: 'V1', pin: 'pos' },
      { kind: 'power', part: 'R2' },
      { kind: 'power', part: 'V1' },
    ]);
  });

  it('non-linear example sheets: bias network, Zener reference, LED, NTC and LDR front ends', () => {
    for (const [file, outs] of [
      ['npn-bias.json', ['net', 'current', 'power']],
      ['zener-reference.json', ['net', 'power']],
      ['led-indicator.json', ['net', 'current']],
      ['ntc-front-end.json', ['net']],
      ['ldr-night-light.json', ['net']],
      ['battery-divider.json', ['net', 'power']],
    ] as const) {
      const s = example(file);
      const c = compileCircuit(s);
      const r = c.solve();
      if (!r.ok) throw new Error(`${file}: ${r.error.message}`);
      const nets = c.netNames.filter((n) => n !== '0');
      const parts = Object.keys(r.parts).filter((id) => r.parts[id].derived && Object.keys(r.parts[id].pinCurrents).length === 2);
      const outputs: SensitivityOutput[] = [];
      if (outs.includes('net' as never)) outputs.push(...nets.slice(0, 3).map((net) => ({ kind: 'net' as const, net })));
      if (outs.includes('current' as never) && parts[0]) outputs.push({ kind: 'current', part: parts[0], pin: Object.keys(r.parts[parts[0]].pinCurrents)[0] });
      if (outs.includes('power' as never) && parts[1]) outputs.push({ kind: 'power', part: parts[1] });
      expectMatchesFiniteDifferences(s, outputs);
    }
  });

  it('a 150-stage diode ladder (sparse LU): every resistance from one transposed solve', () => {
    const parts = [part('V1', 'dc_voltage_source', { voltage: 10 }), part('G', 'ground'), part('L', 'net_label', { name: 'end' })];
    const wires = [wire('V1.neg', 'G.g')];
    let prev = 'V1.pos';
    for (let i = 0; i < 150; i++) {
      parts.push(part(`R${i}`, 'resistor', { resistance: 10 + i }), part(`D${i}`, 'diode'));
      wires.push(wire(prev, `R${i}.a`), wire(`R${i}.b`, `D${i}.anode`), wire(`D${i}.cathode`, 'G.g'));
      prev = `R${i}.b`;
    }
    wires.push(wire(prev, 'L.n'));
    const c = compileCircuit(sheet(parts, wires));
    expect(c.solveRaw().ok).toBe(true);
    expect(c.linearSolverName).toMatch(/sparse/i);
    const rep = c.sensitivities({ kind: 'net', net: 'end' });
    expect(rep.entries).toHaveLength(151);
    for (const e of rep.entries.filter((_, i) => i % 30 === 1)) {
      const fd = finiteDifference(c, { kind: 'net', net: 'end' }, e.part, e.param, e.value);
      expect(Math.abs(e.derivative! - fd)).toBeLessThanOrEqual(1e-4 * Math.abs(fd) + 1e-15);
    }
  });

  it('says when a param cannot move without changing the circuit, and refuses unknown names', () => {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 5 }), part('R1', 'resistor', { resistance: 1e-6 }), part('R2', 'resistor', { resistance: 100 }), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'R2.a'), wire('R2.b', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const c = compileCircuit(s);
    expect(() => c.sensitivities({ kind: 'net', net: 'N1' })).toThrow(/no solution/);
    c.solve();
    const rep = c.sensitivities({ kind: 'current', part: 'R2', pin: 'a' });
    // R1 sits exactly at the 1 µΩ link threshold: 1e-6 − h would make it an ideal link
    const r1 = rep.entries.find((e) => e.part === 'R1')!;
    expect(r1.derivative).toBeNull();
    expect(r1.reason).toMatch(/structure/);
    expect(() => c.sensitivities({ kind: 'net', net: 'nope' })).toThrow(/no net/);
    expect(() => c.sensitivities({ kind: 'current', part: 'R2', pin: 'x' })).toThrow(/no pin/);
    expect(() => c.sensitivities({ kind: 'net', net: 'N1' }, [{ part: 'R2', param: 'tolerance' }, { part: 'R9', param: 'resistance' }])).toThrow(/R9/);
  });
});
