import { describe, expect, it } from 'vitest';
import { guessMapping, parseBenchCsv, readCell } from '../../../src/editor/tools/sweep/benchData';

describe('bench CSV', () => {
  it('reads plain numbers and engineering notation (IEC 60062 RKM / SI prefixes, as parseValue documents)', () => {
    expect(readCell('3.3')).toBe(3.3);
    expect(readCell('4k7')).toBe(4700);
    expect(readCell('12 mA')).toBeCloseTo(0.012, 15);
    expect(readCell('-40')).toBe(-40);
    expect(readCell('')).toBeNaN();
    expect(readCell('n/a')).toBeNaN();
  });
  it('parses a header row, a byte-order mark and semicolons; counts unreadable rows', () => {
    const t = parseBenchCsv('\uFEFFposition;V(tap) [V]\n0;0\n0.5;2.49\n1;x\n1;5.01\n', 'bench.csv');
    expect(t.columns).toEqual(['position', 'V(tap) [V]']);
    expect(t.rows).toBe(4);
    expect(t.values[1]).toEqual([0, 2.49, NaN, 5.01]);
    expect(t.notes[0]).toMatch(/1 row had a cell that is not a number/);
  });
  it('treats an all-number first row as data', () => {
    const t = parseBenchCsv('0,1\n1,2\n');
    expect(t.columns).toEqual(['column 1', 'column 2']);
    expect(t.rows).toBe(2);
  });
  it('says what to fix when there are not two numeric columns', () => {
    expect(() => parseBenchCsv('a\n1\n2\n', 'one.csv')).toThrow(/one.csv: need two columns of numbers/);
    expect(() => parseBenchCsv('a,b\n', 'empty.csv')).toThrow(/header row and at least one row/);
  });
  it('maps columns to outputs by their headers', () => {
    const t = parseBenchCsv('V1 voltage,tap [V],I(R1.a)\n10,2.8,0.001\n12,3.2,0.0012\n');
    const m = guessMapping(t, 'V1.voltage', ['V(tap)', 'I(R1.a)']);
    expect(m.xColumn).toBe(0);
    expect(m.yColumns).toEqual({ 1: 'V(tap)', 2: 'I(R1.a)' });
  });
  it('falls back to the first reading column and the first output', () => {
    const t = parseBenchCsv('x,reading\n1,2\n');
    expect(guessMapping(t, 'RV1.position', ['V(out)'])).toEqual({ xColumn: 0, yColumns: { 1: 'V(out)' } });
  });
});
