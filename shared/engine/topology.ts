// Structural diagnostics, before any numbers: ground, voltage-source loops, nets with no DC path
// to ground, current sources with nowhere to send their current.
import type { TopologyEdge } from './device';
import type { SolveErrorInfo } from './result';

export interface PartTopology {
  partId: string;
  type: string;
  /** net index per pin */
  pinNets: number[];
  edges: TopologyEdge[];
  /** human description of the part's value for messages, e.g. "5 V" */
  valueText?: string;
}

export interface TopologyInput {
  netNames: string[];
  netPins: string[][];
  groundIndex: number;
  /** nets that take part in the solve */
  active: boolean[];
  parts: PartTopology[];
}

/** "a, b and c", or "a, b, … and 12 more" past `max` items. */
function joinList(items: string[], max = 6): string {
  if (items.length <= 1) return items.join('');
  if (items.length > max) return `${items.slice(0, max).join(', ')} and ${items.length - max} more`;
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

function listNames(names: string[], max = 6): string {
  return joinList(names.slice(0, max + 1).map((n) => `"${n}"`).concat(names.slice(max + 1)), max);
}

function listParts(ids: string[], max = 6): string {
  return joinList(ids, max);
}

function fmtV(v: number): string {
  return `${Number(v.toPrecision(4))} V`;
}

/** Returns the first structural problem found, or null. */
export function checkTopology(t: TopologyInput): SolveErrorInfo | null {
  if (t.groundIndex < 0)
    return {
      code: 'no_ground',
      message:
        'The sheet has no ground, so no voltage can be measured against anything. Add a ground part and wire it to the circuit\'s 0 V rail (for example the negative pin of the supply).',
      parts: [],
      nets: [],
    };

  const nNets = t.netNames.length;
  // ground symbols and labels sit on nets but are no help in fixing one: leave them out of lists
  const connectors = new Set(t.parts.filter((p) => p.type === 'ground' || p.type === 'net_label').map((p) => p.partId));

  // ---- loops of ideal voltage constraints (sources without internal resistance, 0 Ω links)
  // union-find with offsets: pot[i] = v(i) − v(root(i))
  const parent = Array.from({ length: nNets }, (_, i) => i);
  const pot = new Float64Array(nNets);
  // union by size keeps the trees shallow: a chain of 10⁴ sources would otherwise make every
  // rootOf walk the whole chain
  const size = new Int32Array(nNets).fill(1);
  const byId = new Map(t.parts.map((p) => [p.partId, p] as const));
  // walk to the root accumulating the offsets
  const rootOf = (i: number): [number, number] => {
    let acc = 0;
    let k = i;
    while (parent[k] !== k) {
      acc += pot[k];
      k = parent[k];
    }
    return [k, acc];
  };
  // adjacency of accepted voltage edges, to name the loop
  const vAdj: Array<Array<{ to: number; partId: string; value: number }>> = Array.from({ length: nNets }, () => []);
  for (const p of t.parts) {
    for (const e of p.edges) {
      if (e.kind !== 'voltage') continue;
      const na = p.pinNets[e.a];
      const nb = p.pinNets[e.b];
      if (!t.active[na] || !t.active[nb]) continue;
      if (na === nb) {
        if (!e.source) continue; // a 0 Ω link with both ends on one net does nothing
        return {
          code: 'voltage_source_loop',
          message: `${p.partId} is short-circuited: both of its pins are on net "${t.netNames[na]}", but it forces ${fmtV(e.value)} between them. Remove the wire across it, or give it an internal resistance.`,
          parts: [p.partId],
          nets: [t.netNames[na]],
        };
      }
      const [ra, pa] = rootOf(na);
      const [rb, pb] = rootOf(nb);
      if (ra !== rb) {
        // v(na) − v(nb) = value; v(na) = v(ra) + pa, v(nb) = v(rb) + pb
        if (size[ra] >= size[rb]) {
          // v(rb) = v(ra) + pa − value − pb
          parent[rb] = ra;
          pot[rb] = pa - e.value - pb;
          size[ra] += size[rb];
        } else {
          // v(ra) = v(rb) + pb + value − pa
          parent[ra] = rb;
          pot[ra] = pb + e.value - pa;
          size[rb] += size[ra];
        }
        vAdj[na].push({ to: nb, partId: p.partId, value: e.value });
        vAdj[nb].push({ to: na, partId: p.partId, value: -e.value });
        continue;
      }
      // already tied by ideal constraints: find the path na → nb
      const prev = new Map<number, { from: number; partId: string }>();
      prev.set(na, { from: -1, partId: '' });
      const q = [na];
      for (let h = 0; h < q.length && !prev.has(nb); h++)
        for (const ed of vAdj[q[h]])
          if (!prev.has(ed.to)) {
            prev.set(ed.to, { from: q[h], partId: ed.partId });
            q.push(ed.to);
          }
      const inLoop = new Set<string>([p.partId]);
      const loopNets: number[] = [nb];
      for (let k = nb; k !== na; ) {
        const s = prev.get(k)!;
        inLoop.add(s.partId);
        k = s.from;
        loopNets.push(k);
      }
      const loopParts = [...inLoop];
      const implied = pa - pb; // v(na) − v(nb) already fixed by the others
      const mismatch = implied - e.value;
      const scale = Math.max(Math.abs(implied), Math.abs(e.value), 1e-3);
      const sources = loopParts.map((id) => byId.get(id)!).filter((pp) => pp.edges.some((ee) => ee.kind === 'voltage' && ee.source));
      const nets = loopNets.map((n) => t.netNames[n]);
      const described = loopParts.slice(0, 7).map((id) => {
        const pp = byId.get(id)!;
        return pp.valueText ? `${id} (${pp.valueText})` : id;
      });
      if (Math.abs(mismatch) > 1e-9 * scale) {
        const parallel = loopParts.length === 2 ? 'are in parallel' : 'form a loop';
        return {
          code: 'voltage_source_loop',
          message: `${listParts(described.length < loopParts.length ? [...described, ...loopParts.slice(7)] : described)} ${parallel} but force different voltages (${fmtV(e.value)} against ${fmtV(implied)} between "${t.netNames[na]}" and "${t.netNames[nb]}"), so no current can satisfy them. Remove one, or give a source an internal resistance.`,
          parts: loopParts,
          nets,
        };
      }
      const what = sources.length === 0 ? 'ideal 0 Ω links' : sources.length === loopParts.length ? 'ideal voltage sources' : 'ideal voltage sources and 0 Ω links';
      return {
        code: 'voltage_source_loop',
        message: `${listParts(described.length < loopParts.length ? [...described, ...loopParts.slice(7)] : described)} ${loopParts.length === 2 ? `are ${what} in parallel` : `form a loop of ${what}`}: the voltages agree, but how the current divides between them is undetermined. Give one of them ${sources.length ? 'an internal resistance' : 'a non-zero on-resistance'}, or remove one.`,
        parts: loopParts,
        nets,
      };
    }
  }

  // ---- DC paths to ground (resistive and voltage edges conduct; current sources do not)
  const adj: number[][] = Array.from({ length: nNets }, () => []);
  for (const p of t.parts)
    for (const e of p.edges) {
      if (e.kind === 'current') continue;
      const na = p.pinNets[e.a];
      const nb = p.pinNets[e.b];
      if (na === nb) continue;
      adj[na].push(nb);
      adj[nb].push(na);
    }
  const comp = new Int32Array(nNets).fill(-1);
  let nComp = 0;
  for (let s = 0; s < nNets; s++) {
    if (comp[s] >= 0 || !t.active[s]) continue;
    const q = [s];
    comp[s] = nComp;
    for (let h = 0; h < q.length; h++)
      for (const v of adj[q[h]])
        if (comp[v] < 0) {
          comp[v] = nComp;
          q.push(v);
        }
    nComp++;
  }
  const gComp = comp[t.groundIndex];
  const floatingComps: number[] = [];
  for (let c = 0; c < nComp; c++) if (c !== gComp) floatingComps.push(c);
  if (!floatingComps.length) return null;

  // nets and current sources per component, in one pass each (a loop per component over all
  // nets and parts costs components × parts: 10⁸ steps for 10⁴ islands)
  const netsOf: number[][] = Array.from({ length: nComp }, () => []);
  for (let i = 0; i < nNets; i++) if (comp[i] >= 0 && t.active[i]) netsOf[comp[i]].push(i);
  const feedingOf = new Map<number, PartTopology[]>();
  for (const p of t.parts)
    for (const e of p.edges) {
      if (e.kind !== 'current') continue;
      for (const c of new Set([comp[p.pinNets[e.a]], comp[p.pinNets[e.b]]])) {
        if (c < 0) continue;
        const list = feedingOf.get(c) ?? [];
        if (!list.includes(p)) list.push(p);
        feedingOf.set(c, list);
      }
    }
  // current sources feeding a component with no DC path: the more specific diagnosis first
  for (const c of floatingComps) {
    const nets = netsOf[c];
    const feeding = feedingOf.get(c) ?? [];
    if (feeding.length) {
      const netNames = nets.map((i) => t.netNames[i]);
      const others = new Set<string>();
      for (const i of nets) for (const pin of t.netPins[i]) if (!connectors.has(pin.split('.')[0])) others.add(pin.split('.')[0]);
      for (const f of feeding) others.delete(f.partId);
      const ids = feeding.map((f) => f.partId);
      const only = others.size === 0 ? `only ${listParts(ids)} ${ids.length > 1 ? 'connect' : 'connects'} there` : `${listParts([...others])} ${others.size > 1 ? 'do' : 'does'} not give it a DC path to ground`;
      return {
        code: 'current_source_no_path',
        message: `${listParts(ids)} ${ids.length > 1 ? 'drive' : 'drives'} current into net${netNames.length > 1 ? 's' : ''} ${listNames(netNames)}, but nothing there can carry it back to ground (${only}). Connect a resistor or load from there to the rest of the circuit, or check the wiring of ${ids[0]}.`,
        parts: [...ids, ...others],
        nets: netNames,
      };
    }
  }
  const allNets: string[] = [];
  const allParts = new Set<string>();
  for (const c of floatingComps)
    for (const i of netsOf[c]) {
      allNets.push(t.netNames[i]);
      for (const pin of t.netPins[i]) if (!connectors.has(pin.split('.')[0])) allParts.add(pin.split('.')[0]);
    }
  return {
    code: 'floating_net',
    message: `Net${allNets.length > 1 ? 's' : ''} ${listNames(allNets)} ${allNets.length > 1 ? 'have' : 'has'} no DC path to ground, so ${allNets.length > 1 ? 'their voltages are' : 'its voltage is'} undetermined (parts there: ${listParts([...allParts])}). Wire ${allNets.length > 1 ? 'them' : 'it'} to the rest of the circuit or add a resistor to ground.`,
    parts: [...allParts],
    nets: allNets,
  };
}
