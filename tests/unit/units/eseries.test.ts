import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  E_SERIES,
  E_SERIES_NAMES,
  allPreferredValues,
  isPreferred,
  nearestPreferred,
  preferredValuesBetween,
  roundDownPreferred,
  roundUpPreferred,
  seriesContaining,
  seriesForTolerance,
  stepDown,
  stepUp,
  usualTolerance,
  type ESeriesName,
} from '../../../shared/units/eseries';

// IEC 60063:2015, Table 1 (E6, E12, E24; two significant figures) and Table 2 (E48, E96, E192;
// three significant figures), as listed in /work/shared/references.md (read from the standard;
// the lists agree with an independent library). Kept as text here, separate from the module's data.
const IEC_60063_TABLES: Record<ESeriesName, string> = {
  E6: '10 15 22 33 47 68',
  E12: '10 12 15 18 22 27 33 39 47 56 68 82',
  E24: '10 11 12 13 15 16 18 20 22 24 27 30 33 36 39 43 47 51 56 62 68 75 82 91',
  E48: `100 105 110 115 121 127 133 140 147 154 162 169 178 187 196 205 215 226 237 249 261 274 287 301
    316 332 348 365 383 402 422 442 464 487 511 536 562 590 619 649 681 715 750 787 825 866 909 953`,
  E96: `100 102 105 107 110 113 115 118 121 124 127 130 133 137 140 143 147 150 154 158 162 165 169 174
    178 182 187 191 196 200 205 210 215 221 226 232 237 243 249 255 261 267 274 280 287 294 301 309
    316 324 332 340 348 357 365 374 383 392 402 412 422 432 442 453 464 475 487 499 511 523 536 549
    562 576 590 604 619 634 649 665 681 698 715 732 750 768 787 806 825 845 866 887 909 931 953 976`,
  E192: `100 101 102 104 105 106 107 109 110 111 113 114 115 117 118 120 121 123 124 126 127 129 130 132
    133 135 137 138 140 142 143 145 147 149 150 152 154 156 158 160 162 164 165 167 169 172 174 176
    178 180 182 184 187 189 191 193 196 198 200 203 205 208 210 213 215 218 221 223 226 229 232 234
    237 240 243 246 249 252 255 258 261 264 267 271 274 277 280 284 287 291 294 298 301 305 309 312
    316 320 324 328 332 336 340 344 348 352 357 361 365 370 374 379 383 388 392 397 402 407 412 417
    422 427 432 437 442 448 453 459 464 470 475 481 487 493 499 505 511 517 523 530 536 542 549 556
    562 569 576 583 590 597 604 612 619 626 634 642 649 657 665 673 681 690 698 706 715 723 732 741
    750 759 768 777 787 796 806 816 825 835 845 856 866 876 887 898 909 920 931 942 953 965 976 988`,
};

const table = (name: ESeriesName) => IEC_60063_TABLES[name].trim().split(/\s+/).map(Number);
const geometric = (i: number, n: number, scale: number) => Math.round(scale * 10 ** (i / n));

describe('IEC 60063:2015 tables', () => {
  it.each(E_SERIES_NAMES)('%s matches the published table value for value', (name) => {
    expect(E_SERIES[name].mantissas).toEqual(table(name));
    expect(E_SERIES[name].perDecade).toBe(Number(name.slice(1)));
  });

  it('E6 ⊂ E12 ⊂ E24 and E48 ⊂ E96 ⊂ E192, each the even-indexed values of the next (IEC 60063)', () => {
    const pairs: [ESeriesName, ESeriesName][] = [['E6', 'E12'], ['E12', 'E24'], ['E48', 'E96'], ['E96', 'E192']];
    for (const [coarse, fine] of pairs) {
      expect(table(fine).filter((_, i) => i % 2 === 0)).toEqual(table(coarse));
    }
  });

  it('E24 is not a subset of E96 (IEC 60063 note; e.g. 1.2 is not 1.21)', () => {
    const e96 = new Set(table('E96'));
    const missing = table('E24').filter((m) => !e96.has(m * 10));
    expect(missing.length).toBeGreaterThan(0);
    expect(missing).toContain(12);
  });

  it('exactly eight E24 values are not the rounded geometric value: 27 30 33 36 39 43 47 82 (IEC 60063)', () => {
    const odd = table('E24').filter((m, i) => m !== geometric(i, 24, 10));
    expect(odd).toEqual([27, 30, 33, 36, 39, 43, 47, 82]);
  });

  it('E48 and E96 are exactly round(100·10^(i/N)) (IEC 60063)', () => {
    for (const name of ['E48', 'E96'] as const) {
      const n = E_SERIES[name].perDecade;
      expect(table(name)).toEqual(table(name).map((_, i) => geometric(i, n, 100)));
    }
  });

  it("E192's only departure from round(100·10^(i/192)) is 920 (geometric 919) (IEC 60063)", () => {
    const odd = table('E192')
      .map((m, i) => [m, geometric(i, 192, 100)])
      .filter(([m, g]) => m !== g);
    expect(odd).toEqual([[920, 919]]);
  });

  it('pairs each series with its usual tolerance (common practice)', () => {
    expect(E_SERIES_NAMES.map(usualTolerance)).toEqual([0.2, 0.1, 0.05, 0.02, 0.01, 0.005]);
    expect(seriesForTolerance(0.05)).toBe('E24');
    expect(seriesForTolerance(0.01)).toBe('E96');
    expect(seriesForTolerance(0.3)).toBe('E6');
    expect(seriesForTolerance(0.001)).toBe('E192');
  });
});

describe('preferred values over decades, 1 mΩ … 1 TΩ', () => {
  it('spans fifteen decades plus the closing 1 TΩ', () => {
    const e24 = allPreferredValues('E24');
    expect(e24.length).toBe(24 * 15 + 1);
    expect(e24[0]).toBe(0.001);
    expect(e24[e24.length - 1]).toBe(1e12);
    // Each value is the double nearest its decimal spelling, so they compare exactly.
    expect(e24).toContain(4700);
    expect(e24).toContain(0.47);
    expect(allPreferredValues('E96')).toContain(10200);
    expect(allPreferredValues('E96')).toContain(1.02);
  });

  it('lists values between two bounds inclusively', () => {
    expect(preferredValuesBetween('E12', 1000, 4700)).toEqual([1000, 1200, 1500, 1800, 2200, 2700, 3300, 3900, 4700]);
  });

  it('finds the nearest value in log distance (midpoint is the geometric mean)', () => {
    // √(4.7·5.1) = 4.8959 k: just below goes down, just above goes up.
    expect(nearestPreferred(4890, 'E24')).toBe(4700);
    expect(nearestPreferred(4900, 'E24')).toBe(5100);
    expect(nearestPreferred(9600, 'E24')).toBe(10000);
    expect(nearestPreferred(1e-9, 'E24')).toBe(0.001);
    expect(nearestPreferred(5e15, 'E24')).toBe(1e12);
    expect(() => nearestPreferred(0, 'E24')).toThrow(/positive/);
  });

  it('agrees with a brute-force nearest search on random values (log distance)', () => {
    fc.assert(
      fc.property(fc.double({ min: -3, max: 12, noNaN: true }), fc.constantFrom(...E_SERIES_NAMES), (exp, name) => {
        const x = 10 ** exp;
        const all = allPreferredValues(name);
        let best = all[0];
        for (const v of all) if (Math.abs(Math.log(v / x)) < Math.abs(Math.log(best / x))) best = v;
        const got = nearestPreferred(x, name);
        // Equal log distance to two neighbours can only differ by rounding; accept either then.
        expect(Math.abs(Math.abs(Math.log(got / x)) - Math.abs(Math.log(best / x)))).toBeLessThan(1e-12);
      }),
    );
  });

  it('steps up and down across decade boundaries', () => {
    expect(stepUp(4700, 'E24')).toBe(5100);
    expect(stepUp(4700.000000001, 'E24')).toBe(5100);
    expect(stepUp(9100, 'E24')).toBe(10000);
    expect(stepDown(1000, 'E24')).toBe(910);
    expect(stepDown(1000, 'E96')).toBe(976);
    expect(stepUp(1e12, 'E6')).toBeNull();
    expect(stepDown(0.001, 'E6')).toBeNull();
    expect(roundUpPreferred(4700, 'E24')).toBe(4700);
    expect(roundUpPreferred(4701, 'E24')).toBe(5100);
    expect(roundDownPreferred(4699, 'E24')).toBe(4300);
    expect(roundDownPreferred(4700, 'E24')).toBe(4700);
  });

  it('says which series contain a value', () => {
    // 470 appears in E192 too (Table 2), though not in E48 or E96.
    expect(seriesContaining(4700)).toEqual(['E6', 'E12', 'E24', 'E192']);
    expect(seriesContaining(1000)).toEqual(['E6', 'E12', 'E24', 'E48', 'E96', 'E192']);
    expect(seriesContaining(4750)).toEqual(['E96', 'E192']);
    expect(seriesContaining(9200)).toEqual(['E192']);
    expect(seriesContaining(2700)).toEqual(['E12', 'E24']);
    expect(seriesContaining(1234)).toEqual([]);
    expect(isPreferred(0.47, 'E6')).toBe(true);
    expect(isPreferred(-47, 'E6')).toBe(false);
  });
});
