// A new solve keeps the previous view's objects where nothing changed, so subscribers can skip.
import { describe, expect, it } from 'vitest';
import type { SolveSuccess } from '../../../src/editor/solve/resultTypes';
import { emptySolveView, type SolveView } from '../../../src/editor/solve/solveView';
import { shareView } from '../../../src/editor/solve/viewSharing';

function view(tapVolts: number, r2Amps: number): SolveView {
  const result: SolveSuccess = {
    ok: true,
    analysis: 'operating-point',
    nets: { '0': 0, top: 12, tap: tapVolts },
    pins: {},
    parts: {
      GND1: { pinCurrents: { g: 0 }, power: 0, warnings: [] },
      R2: { pinCurrents: { a: r2Amps, b: -r2Amps }, power: r2Amps * tapVolts, warnings: [] },
    },
    warnings: [],
    iterations: 1,
  };
  return {
    ...emptySolveView,
    status: 'ok',
    result,
    warnings: [{ code: 'c', severity: 'caution', partId: 'R2', message: 'warm' }],
    byPart: { R2: [{ code: 'c', severity: 'caution', partId: 'R2', message: 'warm' }] },
    tags: { 'R1.b': { net: 'tap', volts: tapVolts }, 'V1.pos': { net: 'top', volts: 12 } },
    pinNets: { 'R1.b': 'tap', 'V1.pos': 'top' },
  };
}

describe('view sharing', () => {
  it('keeps unchanged tags, part results and findings, and replaces what moved', () => {
    const a = view(3.2, 3.2e-4);
    const b = shareView(a, view(3.3, 3.3e-4));
    expect(b.tags['V1.pos']).toBe(a.tags['V1.pos']);
    expect(b.tags['R1.b']).not.toBe(a.tags['R1.b']);
    expect(b.tags['R1.b'].volts).toBe(3.3);
    expect(b.result!.parts.GND1).toBe(a.result!.parts.GND1);
    expect(b.result!.parts.R2).not.toBe(a.result!.parts.R2);
    expect(b.warnings).toBe(a.warnings);
    expect(b.byPart).toBe(a.byPart);
    expect(b.pinNets).toBe(a.pinNets);
  });

  it('returns the previous objects whole when a solve changes nothing', () => {
    const a = view(3.2, 3.2e-4);
    const b = shareView(a, view(3.2, 3.2e-4));
    expect(b.tags).toBe(a.tags);
    expect(b.result!.parts).toBe(a.result!.parts);
  });
});
