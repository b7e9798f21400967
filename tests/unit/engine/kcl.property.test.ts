// Property test (fast-check): on random solvable sheets mixing every device type, Kirchhoff's
// current law holds at every net to 1e-9 A, each part's pin currents sum to zero, and no result
// value is NaN or infinite. Voltage sources get at least 10 Ω of internal resistance so currents
// stay in a physical range (an ideal supply straight across an LED would drive kiloamperes, where
// 1e-9 A is below double-precision resolution).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveOperatingPoint } from '../../../shared/engine';
import { part, sheet, wire } from '../../support/reference/sheets';

type Spec = { type: string; params: Record<string, unknown>; pins: string[] };

const twoPin = (type: string, params: Record<string, unknown>, pins = ['a', 'b']): Spec => ({ type, params, pins });

const partArb: fc.Arbitrary<Spec> = fc.oneof(
  fc.double({ min: 1, max: 6, noNaN: true }).map((e) => twoPin('resistor', { resistance: 10 ** e })),
  fc.tuple(fc.double({ min: 2, max: 6, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom('linear', 'log')).map(([e, position, taper]) => ({
    type: 'potentiometer',
    params: { resistance: 10 ** e, position, taper },
    pins: ['a', 'w', 'b'],
  })),
  fc.tuple(fc.double({ min: -24, max: 24, noNaN: true }), fc.double({ min: 1, max: 3, noNaN: true })).map(([v, e]) => twoPin('dc_voltage_source', { voltage: v, internalResistance: 10 ** e }, ['pos', 'neg'])),
  fc.double({ min: -0.01, max: 0.01, noNaN: true }).map((i) => twoPin('dc_current_source', { current: i }, ['pos', 'neg'])),
  fc.tuple(fc.double({ min: -15, max: -8, noNaN: true }), fc.double({ min: 1, max: 2, noNaN: true }), fc.boolean()).map(([e, n, bd]) =>
    twoPin('diode', { saturationCurrent: 10 ** e, emissionCoefficient: n, seriesResistance: bd ? 1 : 0, ...(bd ? { breakdownVoltage: 30 } : {}) }, ['anode', 'cathode']),
  ),
  fc.double({ min: 2.4, max: 15, noNaN: true }).map((vz) => twoPin('zener', { zenerVoltage: vz }, ['anode', 'cathode'])),
  fc.double({ min: 1.6, max: 3.4, noNaN: true }).map((vf) => twoPin('led', { forwardVoltage: vf }, ['anode', 'cathode'])),
  fc.tuple(fc.constantFrom('npn', 'pnp'), fc.double({ min: 20, max: 400, noNaN: true })).map(([t, beta]) => ({ type: t, params: { beta }, pins: ['c', 'b', 'e'] })),
  fc.double({ min: -20, max: 100, noNaN: true }).map((t) => twoPin('ntc', { temperatureC: t })),
  fc.double({ min: 0, max: 1000, noNaN: true }).map((lux) => twoPin('ldr', { illuminanceLux: lux })),
  fc.tuple(fc.constantFrom('resistance', 'current', 'power'), fc.double({ min: 0, max: 1, noNaN: true })).map(([mode, u]) =>
    twoPin('load', { mode, value: mode === 'resistance' ? 10 + 1e4 * u : mode === 'current' ? 0.005 * u : 0.05 * u }, ['pos', 'neg']),
  ),
  fc.boolean().map((closed) => twoPin('switch', { closed })),
);

const circuitArb = fc.record({
  nets: fc.integer({ min: 2, max: 7 }),
  tree: fc.array(fc.tuple(fc.double({ min: 1, max: 6, noNaN: true }), fc.nat()), { minLength: 7, maxLength: 7 }),
  supply: fc.double({ min: 0.5, max: 30, noNaN: true }),
  parts: fc.array(fc.tuple(partArb, fc.array(fc.nat(), { minLength: 3, maxLength: 3 })), { minLength: 1, maxLength: 8 }),
});

function build(c: { nets: number; tree: Array<[number, number]>; supply: number; parts: Array<[Spec, number[]]> }) {
  const parts: Array<Record<string, unknown>> = [part('GND', 'ground'), part('VS', 'dc_voltage_source', { voltage: c.supply, internalResistance: 10 })];
  const wires = [wire('VS.neg', 'GND.g')];
  const netPin = (k: number) => (k === 0 ? 'GND.g' : `L${k}.n`);
  for (let k = 1; k <= c.nets; k++) parts.push(part(`L${k}`, 'net_label', { name: `n${k}` }));
  wires.push(wire('VS.pos', netPin(1)));
  // a resistor spanning tree keeps every net on a DC path to ground
  for (let k = 1; k <= c.nets; k++) {
    const [e, to] = c.tree[k - 1];
    parts.push(part(`RT${k}`, 'resistor', { resistance: 10 ** e }));
    wires.push(wire(`RT${k}.a`, netPin(k)), wire(`RT${k}.b`, netPin(to % k)));
  }
  c.parts.forEach(([spec, nodes], i) => {
    const id = `P${i}`;
    parts.push(part(id, spec.type, spec.params));
    spec.pins.forEach((pin, k) => wires.push(wire(`${id}.${pin}`, netPin(nodes[k] % (c.nets + 1)))));
  });
  return sheet(parts, wires);
}

describe('KCL on random sheets', () => {
  it('holds at every net to 1e-9 A, and pin currents sum to zero per part', () => {
    let solved = 0;
    fc.assert(
      fc.property(circuitArb, (c) => {
        const s = build(c);
        const r = solveOperatingPoint(s);
        if (!r.ok) {
          // allowed failures are structured and name what is wrong (e.g. two ideal links in a loop)
          expect(typeof r.error.message).toBe('string');
          expect(r.error.code).not.toBe('internal_error');
          expect(r.error.code).not.toBe('non_finite');
          return;
        }
        solved++;
        const netSum = new Map<string, number>();
        const pinNet = new Map<string, string>();
        // net of every pin from the pins map: group pins by voltage equality is not enough, so rebuild from labels
        for (const w of (s as { wires: Array<{ from: string; to: string }> }).wires) {
          const label = w.to.startsWith('L') && w.to.endsWith('.n') ? `n${w.to.slice(1, -2)}` : w.to === 'GND.g' ? '0' : null;
          if (label) pinNet.set(w.from, label);
        }
        for (const [id, pr] of Object.entries(r.parts)) {
          let sum = 0;
          let scale = 0;
          for (const [pin, i] of Object.entries(pr.pinCurrents)) {
            expect(Number.isFinite(i)).toBe(true);
            sum += i;
            scale = Math.max(scale, Math.abs(i));
            const net = pinNet.get(`${id}.${pin}`);
            if (net) netSum.set(net, (netSum.get(net) ?? 0) + i);
          }
          expect(Math.abs(sum)).toBeLessThanOrEqual(1e-12 + 1e-12 * scale);
          expect(Number.isFinite(pr.power)).toBe(true);
        }
        for (const [net, sum] of netSum) {
          if (Math.abs(sum) > 1e-9) throw new Error(`KCL violated at ${net}: ${sum} A`);
        }
        for (const v of Object.values(r.nets)) expect(Number.isFinite(v)).toBe(true);
      }),
      { numRuns: 300, seed: 20261201 },
    );
    expect(solved).toBeGreaterThan(200);
  }, 120_000);
});
