// What the canvas and panels read from a solve: the result, the merged findings, and which pin
// of each net carries that net's voltage tag.
import { extractNets, type Sheet } from '../../../shared/sheet';
import type { SolveFailure, SolveResult, SolveSuccess, SolveWarning } from './resultTypes';
import { safetyCautions } from './safetyChecks';

export interface NetTag {
  net: string;
  volts: number;
}

export interface SolveView {
  /** 'idle' before the first result */
  status: 'idle' | 'ok' | 'error';
  result: SolveSuccess | null;
  failure: SolveFailure | null;
  /** engine findings and the editor's safety cautions, worst first */
  warnings: SolveWarning[];
  byPart: Record<string, SolveWarning[]>;
  /** "R1.b" → the tag drawn at that pin */
  tags: Record<string, NetTag>;
  /** pin → net name, for every pin (hover titles, the results table) */
  pinNets: Record<string, string>;
  /** solve time, ms */
  ms: number | null;
}

export const emptySolveView: SolveView = {
  status: 'idle',
  result: null,
  failure: null,
  warnings: [],
  byPart: {},
  tags: {},
  pinNets: {},
  ms: null,
};

const RANK: Record<string, number> = { danger: 0, error: 0, warning: 1, caution: 2, info: 3 };

export function severityRank(severity: string): number {
  return RANK[severity] ?? 3;
}

/**
 * One pin per net (not ground) for its voltage tag: a net label's pin if the net has one, else a
 * potentiometer wiper, else the net's first pin in sheet order.
 */
export function tagPins(sheet: Sheet): Record<string, string> {
  const nets = extractNets(sheet);
  const typeOf = new Map(sheet.parts.map((p) => [p.id, p.type] as const));
  const out: Record<string, string> = {};
  for (const net of nets.nets) {
    if (net.isGround || !net.pins.length) continue;
    const partType = (ref: string) => typeOf.get(ref.slice(0, ref.indexOf('.')));
    const pin =
      net.pins.find((r) => partType(r) === 'net_label') ??
      net.pins.find((r) => partType(r) === 'potentiometer' && r.endsWith('.w')) ??
      net.pins[0];
    out[pin] = net.name;
  }
  return out;
}

/** What the view needs from the sheet's wiring alone (the same for every value the parts take). */
export interface SheetTopology {
  /** pin → net name, for every pin */
  pinNets: Record<string, string>;
  /** tagged pin → its net (tagPins) */
  tagPins: Record<string, string>;
}

export function sheetTopology(sheet: Sheet): SheetTopology {
  return { pinNets: extractNets(sheet).pinToNet, tagPins: tagPins(sheet) };
}

/**
 * sheetTopology, remembered for the last wiring: a value change (a slider pull) reuses the
 * previous answer, and with it the same pinNets object, so whatever depends on it stays put.
 */
export function createTopologyCache(): (sheet: Sheet) => SheetTopology {
  let last: { key: string; topo: SheetTopology } | null = null;
  return (sheet) => {
    // net labels name nets through their `name` param
    const key = JSON.stringify([sheet.parts.map((p) => [p.id, p.type, (p.params as { name?: unknown }).name]), sheet.wires.map((w) => [w.from, w.to])]);
    if (last?.key !== key) last = { key, topo: sheetTopology(sheet) };
    return last.topo;
  };
}

/** Build the view from a solved sheet and the engine's answer. */
export function buildSolveView(sheet: Sheet, result: SolveResult, ms: number | null, topology: SheetTopology = sheetTopology(sheet)): SolveView {
  const success = result.ok ? result : null;
  const warnings = [...(result.ok ? result.warnings : (result.warnings ?? [])), ...safetyCautions(sheet, success)];
  // the same finding can arrive at part and sheet level; keep one
  const seen = new Set<string>();
  const unique = warnings
    .filter((w) => {
      const k = `${w.code}|${w.partId ?? ''}|${w.net ?? ''}|${w.message}`;
      if (seen.has(k)) return false;
      seen.add(k);
      return true;
    })
    .sort((a, b) => severityRank(a.severity) - severityRank(b.severity));
  const byPart: Record<string, SolveWarning[]> = {};
  for (const w of unique) if (w.partId) (byPart[w.partId] ??= []).push(w);
  if (!result.ok) for (const id of result.error.parts ?? []) (byPart[id] ??= []).unshift({ code: result.error.code, severity: 'error', partId: id, message: result.error.message });
  const tags: Record<string, NetTag> = {};
  if (success)
    for (const [pin, net] of Object.entries(topology.tagPins)) {
      const volts = success.nets[net];
      if (typeof volts === 'number') tags[pin] = { net, volts };
    }
  return {
    status: result.ok ? 'ok' : 'error',
    result: success,
    failure: result.ok ? null : result,
    warnings: unique,
    byPart,
    tags,
    pinNets: topology.pinNets,
    ms,
  };
}
