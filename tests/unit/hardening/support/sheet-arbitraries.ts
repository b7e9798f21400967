// fast-check generators for the hardening fuzz tests: valid sheets with values from one end of the
// double range to the other, and the hostile mutations of them a file or a JS caller can bring.
import fc from 'fast-check';

type Json = Record<string, unknown>;

/** 10^e for e uniform in [lo, hi], sometimes negated. */
const logUniform = (lo: number, hi: number, signed = false): fc.Arbitrary<number> =>
  fc
    .tuple(fc.double({ min: lo, max: hi, noNaN: true }), signed ? fc.boolean() : fc.constant(false))
    .map(([e, neg]) => (neg ? -1 : 1) * Math.pow(10, e));

/** Values at the edges the engine treats specially: the 1 µΩ link threshold, denormals, the largest doubles. */
const edge = (...xs: number[]) => fc.constantFrom(...xs);

const resistance = fc.oneof(logUniform(-9, 15), edge(1e-6, 9.999999e-7, 1.000001e-6, 5e-324, 1e308));
const positive = (lo: number, hi: number) => fc.oneof({ weight: 12, arbitrary: logUniform(lo, hi) }, { weight: 1, arbitrary: edge(5e-324, 1e-300, 1e300) });

export interface PartSpecArb {
  type: string;
  params: Json;
  pins: string[];
}

const two = (type: string, params: Json, pins = ['a', 'b']): PartSpecArb => ({ type, params, pins });

/** One part of any solvable type, with values from sensible to absurd (all valid per the schema). */
export const extremePart: fc.Arbitrary<PartSpecArb> = fc.oneof(
  fc.record({ resistance, tempco: fc.oneof(fc.constant(0), logUniform(0, 6, true)) }).map((p) => two('resistor', p)),
  fc
    .record({ resistance, position: fc.oneof(fc.double({ min: 0, max: 1, noNaN: true }), edge(0, 1, 1e-300, 1 - 1e-16)), taper: fc.constantFrom('linear', 'log') })
    .map((p) => ({ type: 'potentiometer', params: p, pins: ['a', 'w', 'b'] })),
  fc
    .record({ voltage: fc.oneof(logUniform(-3, 4, true), edge(0, 1e6, -1e6, 1e300)), internalResistance: fc.oneof(edge(0), resistance) })
    .map((p) => two('dc_voltage_source', p, ['pos', 'neg'])),
  fc.record({ current: fc.oneof(logUniform(-12, 3, true), edge(0, 1e200)) }).map((p) => two('dc_current_source', p, ['pos', 'neg'])),
  fc
    .record(
      {
        saturationCurrent: positive(-40, -1),
        emissionCoefficient: positive(-2, 2),
        seriesResistance: fc.oneof(edge(0), resistance),
        breakdownVoltage: positive(-1, 4),
      },
      { requiredKeys: ['saturationCurrent', 'emissionCoefficient'] },
    )
    .map((p) => two('diode', p, ['anode', 'cathode'])),
  fc
    .record({ zenerVoltage: positive(-1, 4), zenerResistance: positive(-6, 6), testCurrent: positive(-6, 0) })
    .map((p) => two('zener', p, ['anode', 'cathode'])),
  fc
    .record({ forwardVoltage: positive(-1, 1), emissionCoefficient: positive(-0.5, 1), testCurrent: positive(-6, -1), seriesResistance: fc.oneof(edge(0), logUniform(-3, 2)) })
    .map((p) => two('led', p, ['anode', 'cathode'])),
  fc
    .tuple(fc.constantFrom('npn', 'pnp'), fc.record({ beta: positive(-3, 6), reverseBeta: positive(-3, 3), saturationCurrent: positive(-30, -3) }))
    .map(([t, p]) => ({ type: t, params: p, pins: ['c', 'b', 'e'] })),
  fc
    .record({ nominalResistance: positive(0, 7), beta: positive(2, 4.5), temperatureC: fc.double({ min: -100, max: 300, noNaN: true }) }, { requiredKeys: [] })
    .map((p) => two('ntc', p)),
  fc.record({ illuminanceLux: fc.oneof(edge(0, 1e-300, 1e12), logUniform(-3, 6)), gamma: positive(-1, 0.5) }, { requiredKeys: [] }).map((p) => two('ldr', p)),
  fc
    .tuple(fc.constantFrom('resistance', 'current', 'power'), logUniform(-9, 6), fc.oneof(edge(0.1), positive(-9, 3)))
    .map(([mode, v, minVoltage]) => two('load', { mode, value: mode === 'current' ? v * (v > 1 ? -1 : 1) : v, minVoltage }, ['pos', 'neg'])),
  fc.record({ closed: fc.boolean(), onResistance: fc.oneof(edge(0), resistance), offResistance: resistance }).map((p) => two('switch', p)),
);

export interface CircuitShape {
  nets: number;
  /** resistor spanning tree (keeps most nets grounded) */
  tree: Array<[number, number]> | null;
  parts: Array<{ spec: PartSpecArb; nodes: Array<number | null> }>;
  temperatureC: number;
  illuminanceLux: number;
}

/** A circuit: nets n1…nk plus ground, an optional resistor tree, and random parts between random nets. */
export const circuitShape = (maxParts = 10): fc.Arbitrary<CircuitShape> =>
  fc.integer({ min: 1, max: 7 }).chain((nets) =>
    fc.record({
      nets: fc.constant(nets),
      tree: fc.option(fc.array(fc.tuple(fc.double({ min: 0, max: 7, noNaN: true }), fc.nat()), { minLength: nets, maxLength: nets }), { freq: 3 }).map((t) =>
        t === null ? null : t.map(([e, to]) => [e, to] as [number, number]),
      ),
      parts: fc.array(
        fc.record({
          spec: extremePart,
          // null: the pin is left unconnected
          nodes: fc.array(fc.option(fc.integer({ min: 0, max: nets }), { freq: 12 }), { minLength: 3, maxLength: 3 }),
        }),
        { minLength: 1, maxLength: maxParts },
      ),
      temperatureC: fc.oneof({ weight: 5, arbitrary: fc.constant(25) }, { weight: 3, arbitrary: fc.double({ min: -60, max: 160, noNaN: true }) }, { weight: 1, arbitrary: edge(-273.1, -200, 500, 5000) }),
      illuminanceLux: fc.oneof(fc.constant(100), edge(0, 1e9), logUniform(-3, 5)),
    }),
  );

/** The sheet for a circuit shape (ids P0…, labels L1…, ground GND). */
export function buildSheet(c: CircuitShape): Json {
  const parts: Json[] = [{ id: 'GND', type: 'ground' }];
  const wires: Array<{ from: string; to: string }> = [];
  const pinOf = (k: number) => (k === 0 ? 'GND.g' : `L${k}.n`);
  for (let k = 1; k <= c.nets; k++) parts.push({ id: `L${k}`, type: 'net_label', params: { name: `n${k}` } });
  if (c.tree)
    c.tree.forEach(([e, to], i) => {
      const k = i + 1;
      parts.push({ id: `RT${k}`, type: 'resistor', params: { resistance: Math.pow(10, e) } });
      wires.push({ from: `RT${k}.a`, to: pinOf(k) }, { from: `RT${k}.b`, to: pinOf(to % k) });
    });
  c.parts.forEach(({ spec, nodes }, i) => {
    const id = `P${i}`;
    parts.push({ id, type: spec.type, params: spec.params });
    spec.pins.forEach((pin, k) => {
      const n = nodes[k];
      if (n !== null && n !== undefined) wires.push({ from: `${id}.${pin}`, to: pinOf(n) });
    });
  });
  return { format: 'tapline.sheet', version: 1, conditions: { temperatureC: c.temperatureC, illuminanceLux: c.illuminanceLux }, parts, wires };
}

/** Values a file or a JS caller may put anywhere. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(NaN, Infinity, -Infinity, -0, 0, 1e308, -1e308, 5e-324, Number.MAX_SAFE_INTEGER + 2, -1),
  fc.constantFrom(null, undefined, true, false, '', ' ', '4k7', '1e3', 'NaN', '__proto__', 'constructor', 'R1.a', 'a.b.c', '.', 'GND.g'),
  // fresh objects each time: a shared constant would carry one run's mutations into the next
  fc.constantFrom(() => [], () => ({}), () => [1, 2], () => ({ a: 1 }), () => ({ x: NaN, y: 0 })).map((make) => make()),
  fc.string({ maxLength: 8 }),
  fc.integer().map((n) => 'x'.repeat(Math.abs(n) % 5000)),
  fc.double(),
  fc.jsonValue({ maxDepth: 2 }),
);

/** Every path into a JSON-like value (arrays by index, objects by key). */
export function pathsOf(v: unknown, prefix: Array<string | number> = [], out: Array<Array<string | number>> = [], seen = new Set<unknown>()): Array<Array<string | number>> {
  out.push(prefix);
  if (v && typeof v === 'object') {
    if (seen.has(v)) return out;
    seen.add(v);
  }
  if (Array.isArray(v)) v.forEach((x, i) => pathsOf(x, [...prefix, i], out, seen));
  else if (v && typeof v === 'object') for (const k of Object.keys(v)) pathsOf((v as Json)[k], [...prefix, k], out, seen);
  return out;
}

export type Mutation =
  | { kind: 'set'; at: number; value: unknown }
  | { kind: 'delete'; at: number }
  | { kind: 'duplicatePart'; at: number }
  | { kind: 'sameId'; at: number; other: number }
  | { kind: 'wire'; from: string; to: string }
  | { kind: 'protoKey'; at: number; value: unknown }
  | { kind: 'retype'; at: number; type: string };

export const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ kind: fc.constant('set' as const), at: fc.nat(), value: hostileValue }),
  fc.record({ kind: fc.constant('delete' as const), at: fc.nat() }),
  fc.record({ kind: fc.constant('duplicatePart' as const), at: fc.nat() }),
  fc.record({ kind: fc.constant('sameId' as const), at: fc.nat(), other: fc.nat() }),
  fc.record({
    kind: fc.constant('wire' as const),
    from: fc.constantFrom('P0.a', 'P0.zz', 'NOPE.a', 'GND.g', 'P1.pos', '__proto__.a', 'P0', '', 'L1.n'),
    to: fc.constantFrom('GND.g', 'L1.n', 'P2.b', 'X.y', 'P0.a', 'constructor.prototype'),
  }),
  fc.record({ kind: fc.constant('protoKey' as const), at: fc.nat(), value: hostileValue }),
  fc.record({ kind: fc.constant('retype' as const), at: fc.nat(), type: fc.constantFrom('resistor', 'ground', 'net_label', 'npn', 'transistor', '', '__proto__', 'toString') }),
);

/**
 * Apply mutations to a deep copy of a sheet. `protoKey` puts a real own "__proto__" key into an
 * object (as JSON.parse does), which plain assignment cannot.
 */
export function mutate(sheet: Json, muts: Mutation[]): unknown {
  let root: unknown = structuredClone(sheet);
  for (const m of muts) {
    const paths = pathsOf(root);
    const parts = (root as Json)?.parts;
    const partList = Array.isArray(parts) ? (parts as unknown[]) : [];
    switch (m.kind) {
      case 'set':
      case 'delete': {
        const path = paths[m.at % paths.length];
        if (path.length === 0) {
          if (m.kind === 'set') root = m.value;
          break;
        }
        const parent = path.slice(0, -1).reduce<unknown>((o, k) => (o as Json)[k as string], root) as Json | unknown[];
        const key = path[path.length - 1];
        if (m.kind === 'delete') {
          if (Array.isArray(parent)) parent.splice(key as number, 1);
          else delete (parent as Json)[key as string];
        } else (parent as Json)[key as string] = m.value;
        break;
      }
      case 'duplicatePart':
        if (partList.length) partList.push(structuredClone(partList[m.at % partList.length]));
        break;
      case 'sameId':
        if (partList.length > 1) {
          const a = partList[m.at % partList.length] as Json;
          const b = partList[m.other % partList.length] as Json;
          if (a && b && typeof a === 'object' && typeof b === 'object') a.id = b.id;
        }
        break;
      case 'wire': {
        const wires = (root as Json)?.wires;
        if (Array.isArray(wires)) wires.push({ from: m.from, to: m.to });
        break;
      }
      case 'protoKey': {
        const objects = paths
          .map((p) => p.reduce<unknown>((o, k) => (o as Json)[k as string], root))
          .filter((o): o is Json => !!o && typeof o === 'object' && !Array.isArray(o));
        if (objects.length) Object.defineProperty(objects[m.at % objects.length], '__proto__', { value: m.value, enumerable: true, writable: true, configurable: true });
        break;
      }
      case 'retype':
        if (partList.length) {
          const p = partList[m.at % partList.length] as Json;
          if (p && typeof p === 'object') p.type = m.type;
        }
        break;
    }
  }
  return root;
}
