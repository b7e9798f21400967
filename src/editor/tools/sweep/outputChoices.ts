// What the analysis panels can measure: each net's voltage, the current through each part (into
// its first pin; both driven pins of a transistor) and each part's power.
import { extractNets, type Sheet } from '../../../../shared/sheet';
import { partSpecs } from '../../../../shared/parts/specs';
import { outputKey, type OutputSpec } from '../../../../shared/analysis/outputs';

export interface OutputChoice {
  spec: OutputSpec;
  /** "V(tap)", "I(R1.a)", "P(R1)" */
  key: string;
  group: 'Net voltage' | 'Current' | 'Power';
  unit: 'V' | 'A' | 'W';
}

const PASSIVE = new Set(['ground', 'net_label']);

export function outputChoices(sheet: Sheet): OutputChoice[] {
  const nets = extractNets(sheet);
  const out: OutputChoice[] = [];
  // labelled nets first: those are the ones people named because they matter
  const named = [...nets.nets].filter((n) => !n.isGround).sort((a, b) => Number(b.labels.length > 0) - Number(a.labels.length > 0));
  for (const n of named) out.push({ spec: { kind: 'net', net: n.name }, key: `V(${n.name})`, group: 'Net voltage', unit: 'V' });
  for (const p of sheet.parts) {
    if (PASSIVE.has(p.type)) continue;
    const pins = partSpecs[p.type].pins.map((x) => x.name);
    const driven = p.type === 'npn' || p.type === 'pnp' ? ['c', 'b'] : pins.slice(0, 1);
    for (const pin of driven) {
      const spec: OutputSpec = { kind: 'current', part: p.id, pin };
      out.push({ spec, key: outputKey(spec), group: 'Current', unit: 'A' });
    }
  }
  for (const p of sheet.parts) {
    if (PASSIVE.has(p.type)) continue;
    const spec: OutputSpec = { kind: 'power', part: p.id };
    out.push({ spec, key: outputKey(spec), group: 'Power', unit: 'W' });
  }
  return out;
}

/** A sensible first choice: the labelled nets, else the first net. */
export function defaultOutputs(choices: readonly OutputChoice[], sheet: Sheet): string[] {
  const labels = new Set(sheet.parts.filter((p) => p.type === 'net_label').map((p) => String((p.params as { name?: unknown }).name)));
  const labelled = choices.filter((c) => c.spec.kind === 'net' && labels.has(c.spec.net)).map((c) => c.key);
  if (labelled.length) return labelled.slice(0, 3);
  const first = choices.find((c) => c.group === 'Net voltage');
  return first ? [first.key] : [];
}
