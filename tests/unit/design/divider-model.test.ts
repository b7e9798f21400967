import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  bottomForOutput,
  dividerOutput,
  outputWindow,
  theveninResistance,
  topForOutput,
} from '../../../shared/design/divider-model';

// references.md, "Divider tolerance and loading" (derivation; closed forms computed to 12 digits):
// 12 V, 27 kΩ over 10 kΩ, ±5 % each: nominal 3.24324324324 V, max 3.48547717842 V, min 3.01188903567 V.
describe('divider closed forms', () => {
  it('matches the worked 12 V, 27k/10k ±5 % case from references.md', () => {
    expect(dividerOutput(12, 27e3, 10e3)).toBeCloseTo(3.24324324324, 10);
    const w = outputWindow({ min: 12, max: 12 }, 27e3, 10e3, 0.05, 0.05);
    expect(w.max).toBeCloseTo(3.48547717842, 10);
    expect(w.min).toBeCloseTo(3.01188903567, 10);
  });

  it('widens the window by the supply range exactly as the closed-form extremes say', () => {
    // V_max = V_hi·R2(1+t)/(R1(1−t)+R2(1+t)); V_min = V_lo·R2(1−t)/(R1(1+t)+R2(1−t)) (references.md).
    const [r1, r2, t, lo, hi] = [27e3, 10e3, 0.05, 10.8, 13.2];
    const w = outputWindow({ min: lo, max: hi }, r1, r2, t, t);
    expect(w.max).toBeCloseTo((hi * r2 * (1 + t)) / (r1 * (1 - t) + r2 * (1 + t)), 12);
    expect(w.min).toBeCloseTo((lo * r2 * (1 - t)) / (r1 * (1 + t) + r2 * (1 - t)), 12);
  });

  it('agrees with the Thevenin form for a resistive load: V_th·R_L/(R_th+R_L) (references.md)', () => {
    // Hand case: 10 V, 10k/10k into 10k: V_th = 5 V, R_th = 5 kΩ, so 5·10/15 = 3.333… V.
    expect(dividerOutput(10, 1e4, 1e4, { kind: 'resistance', ohms: 1e4 })).toBeCloseTo(10 / 3, 12);
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 1, max: 1e7, noNaN: true }),
        fc.double({ min: 1, max: 1e7, noNaN: true }),
        fc.double({ min: 1, max: 1e8, noNaN: true }),
        (v, r1, r2, rl) => {
          const vth = (v * r2) / (r1 + r2);
          const rth = theveninResistance(r1, r2);
          const expected = (vth * rl) / (rth + rl);
          expect(dividerOutput(v, r1, r2, { kind: 'resistance', ohms: rl })).toBeCloseTo(expected, 9);
        },
      ),
    );
  });

  it('agrees with V_th − I·R_th for a current drawn from the tap', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 1e-3, noNaN: true }),
        (v, r1, r2, i) => {
          const expected = (v * r2) / (r1 + r2) - i * theveninResistance(r1, r2);
          const got = dividerOutput(v, r1, r2, { kind: 'current', amps: i });
          expect(Math.abs(got - expected)).toBeLessThan(1e-9 * Math.max(1, Math.abs(expected), v));
        },
      ),
    );
  });

  it('solves either leg back to the wanted output, for every load kind', () => {
    const loads = [{ kind: 'none' } as const, { kind: 'resistance', ohms: 47e3 } as const, { kind: 'current', amps: 20e-6 } as const];
    for (const load of loads) {
      const r1 = topForOutput(12, 3.3, 10e3, load)!;
      expect(dividerOutput(12, r1, 10e3, load)).toBeCloseTo(3.3, 10);
      const r2 = bottomForOutput(12, 3.3, 27e3, load)!;
      expect(dividerOutput(12, 27e3, r2, load)).toBeCloseTo(3.3, 10);
    }
    expect(bottomForOutput(12, 6, 1e6, { kind: 'resistance', ohms: 1e3 })).toBeNull(); // load too heavy
    expect(bottomForOutput(12, 6, 1e6, { kind: 'current', amps: 1e-3 })).toBeNull();
    expect(topForOutput(5, 6, 1e3)).toBeNull(); // cannot divide up
  });

  it('never finds an interior point outside the corner window (corner argument in divider-model.ts)', () => {
    fc.assert(
      fc.property(
        fc.record({
          r1: fc.double({ min: 10, max: 1e6, noNaN: true }),
          r2: fc.double({ min: 10, max: 1e6, noNaN: true }),
          t: fc.double({ min: 0, max: 0.2, noNaN: true }),
          u: fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })),
          loadKind: fc.constantFrom('none', 'resistance', 'current'),
        }),
        ({ r1, r2, t, u, loadKind }) => {
          const load =
            loadKind === 'none' ? ({ kind: 'none' } as const) : loadKind === 'resistance' ? ({ kind: 'resistance', ohms: 2e4 } as const) : ({ kind: 'current', amps: 1e-5 } as const);
          const supply = { min: 4.5, max: 5.5 };
          const w = outputWindow(supply, r1, r2, t, t, load);
          const v = supply.min + u[2] * (supply.max - supply.min);
          const out = dividerOutput(v, r1 * (1 + u[0] * t), r2 * (1 + u[1] * t), load);
          const slack = 1e-12 * Math.max(1, Math.abs(out));
          expect(out).toBeGreaterThanOrEqual(w.min - slack);
          expect(out).toBeLessThanOrEqual(w.max + slack);
        },
      ),
      { numRuns: 2000 },
    );
  });
});
