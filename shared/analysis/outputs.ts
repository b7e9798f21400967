// What an analysis measures: a net voltage, the current into one pin of a part, or the power a
// part absorbs. Checked against the sheet up front so a typo fails with a list of what exists.
import type { SolveSuccess } from '../engine/result';
import { partSpecs } from '../parts/specs';
import type { NetList } from '../sheet/nets';
import type { Sheet } from '../sheet/schema';

export type OutputSpec =
  /** voltage of a net against the reference net "0", V */
  | { kind: 'net'; net: string }
  /** current INTO the part at that pin, A (sheet-format convention) */
  | { kind: 'current'; part: string; pin: string }
  /** power absorbed by the part, W (negative for a part that delivers power) */
  | { kind: 'power'; part: string };

/** Short label used as a column and key: V(tap), I(R1.a), P(R1). */
export function outputKey(o: OutputSpec): string {
  switch (o.kind) {
    case 'net':
      return `V(${o.net})`;
    case 'current':
      return `I(${o.part}.${o.pin})`;
    case 'power':
      return `P(${o.part})`;
  }
}

export function outputUnit(o: OutputSpec): 'V' | 'A' | 'W' {
  return o.kind === 'net' ? 'V' : o.kind === 'current' ? 'A' : 'W';
}

/** Parse "V(tap)", "I(R1.a)", "P(R1)" (or "tap" for a net) into an OutputSpec; null if malformed. */
export function parseOutputKey(text: string): OutputSpec | null {
  const t = text.trim();
  let m = /^V\((.+)\)$/i.exec(t);
  if (m) return { kind: 'net', net: m[1] };
  m = /^I\(([^.\s]+)\.([^.\s]+)\)$/i.exec(t);
  if (m) return { kind: 'current', part: m[1], pin: m[2] };
  m = /^P\(([^.\s]+)\)$/i.exec(t);
  if (m) return { kind: 'power', part: m[1] };
  if (/^[^\s()]+$/.test(t)) return { kind: 'net', net: t };
  return null;
}

/** A message for every output that does not exist on the sheet (empty when all are fine). */
export function checkOutputs(sheet: Sheet, nets: NetList, outputs: readonly OutputSpec[]): string[] {
  const problems: string[] = [];
  const netNames = nets.nets.map((n) => n.name);
  for (const o of outputs) {
    if (o.kind === 'net') {
      if (!nets.byName.has(o.net)) problems.push(`Output ${outputKey(o)}: there is no net "${o.net}". Nets on this sheet: ${netNames.join(', ')}. Name a net with a net_label part to refer to it.`);
      continue;
    }
    const part = sheet.parts.find((p) => p.id === o.part);
    if (!part) {
      problems.push(`Output ${outputKey(o)}: there is no part "${o.part}". Parts: ${sheet.parts.map((p) => p.id).join(', ')}.`);
      continue;
    }
    if (o.kind === 'current') {
      const pins = partSpecs[part.type].pins.map((p) => p.name);
      if (!pins.includes(o.pin)) problems.push(`Output ${outputKey(o)}: part "${o.part}" (${part.type}) has no pin "${o.pin}"; its pins are ${pins.join(', ')}.`);
    }
  }
  return problems;
}

/** Read an output from a solved operating point (NaN when the net or part took no part in the solve). */
export function readOutput(r: SolveSuccess, o: OutputSpec): number {
  switch (o.kind) {
    case 'net':
      return r.nets[o.net] ?? NaN;
    case 'current':
      return r.parts[o.part]?.pinCurrents[o.pin] ?? NaN;
    case 'power':
      return r.parts[o.part]?.power ?? NaN;
  }
}
