// Net extraction: wires are transitive, ground is "0", labels join and name nets, other names are
// generated deterministically in order of first appearance.
import { describe, expect, it } from 'vitest';
import { extractNets, parseSheet, type Sheet } from '../../../shared/sheet';

function mk(parts: Array<Record<string, unknown>>, wires: Array<[string, string]>): Sheet {
  const r = parseSheet({ format: 'tapline.sheet', version: 1, parts, wires: wires.map(([from, to]) => ({ from, to })) });
  if (!r.ok) throw new Error(r.error.message);
  return r.sheet;
}
const R = (id: string) => ({ id, type: 'resistor', params: { resistance: 1 } });

describe('extractNets', () => {
  it('groups pins transitively, names ground "0" and others N1, N2 … by first appearance', () => {
    const s = mk([R('R1'), R('R2'), R('R3'), { id: 'G', type: 'ground' }], [['R1.b', 'R2.a'], ['R2.a', 'R3.a'], ['R3.b', 'G.g'], ['R2.b', 'G.g']]);
    const n = extractNets(s);
    expect(n.pinToNet).toEqual({ 'R1.a': 'N1', 'R1.b': 'N2', 'R2.a': 'N2', 'R3.a': 'N2', 'R2.b': '0', 'R3.b': '0', 'G.g': '0' });
    expect(n.nets.map((x) => x.name)).toEqual(['N1', 'N2', '0']);
    expect(n.groundIndex).toBe(2);
  });

  it('does not depend on wire order or direction', () => {
    const parts = [R('R1'), R('R2'), R('R3'), { id: 'G', type: 'ground' }];
    const a = extractNets(mk(parts, [['R1.b', 'R2.a'], ['R2.a', 'R3.a'], ['R3.b', 'G.g']]));
    const b = extractNets(mk(parts, [['G.g', 'R3.b'], ['R3.a', 'R2.a'], ['R2.a', 'R1.b']]));
    expect(b.pinToNet).toEqual(a.pinToNet);
  });

  it('labels with the same name join nets and name them; a label "0" is ground; several grounds are one net', () => {
    const s = mk(
      [R('R1'), R('R2'), { id: 'L1', type: 'net_label', params: { name: 'vout' } }, { id: 'L2', type: 'net_label', params: { name: 'vout' } }, { id: 'L3', type: 'net_label', params: { name: '0' } }, { id: 'G1', type: 'ground' }, { id: 'G2', type: 'ground' }],
      [['R1.b', 'L1.n'], ['R2.a', 'L2.n'], ['R2.b', 'L3.n'], ['R1.a', 'G2.g']],
    );
    const n = extractNets(s);
    expect(n.pinToNet['R1.b']).toBe('vout');
    expect(n.pinToNet['R2.a']).toBe('vout');
    expect(n.pinToNet['R2.b']).toBe('0');
    expect(n.pinToNet['R1.a']).toBe('0');
    expect(n.pinToNet['G1.g']).toBe('0');
  });

  it('generated names skip label names, and conflicting labels are reported', () => {
    const s = mk(
      [R('R1'), R('R2'), { id: 'L1', type: 'net_label', params: { name: 'N1' } }, { id: 'L2', type: 'net_label', params: { name: 'a' } }, { id: 'L3', type: 'net_label', params: { name: 'b' } }],
      [['R2.a', 'L1.n'], ['R2.b', 'L2.n'], ['L2.n', 'L3.n']],
    );
    const n = extractNets(s);
    expect(n.pinToNet['R1.a']).toBe('N2');
    expect(n.pinToNet['R2.a']).toBe('N1');
    expect(n.pinToNet['R2.b']).toBe('a');
    expect(n.notices.map((x) => x.code)).toEqual(['net_label_conflict']);
  });
});
