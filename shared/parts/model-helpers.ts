// Building blocks shared by the device models.
import { GROUND, isLink, nodeV, type Allocator, type Device, type DeviceWarning, type ResidualSink, type Stamper, type TopologyEdge } from '../engine/device';
import { JUNCTION_CURRENT_CEILING, junctionCurrent, limitJunction, type JunctionParams } from '../engine/junction';

/** A linear two-terminal resistance between nodes a and b; 0 Ω becomes a branch-current link. */
export interface Element {
  load(s: Stamper, x: Float64Array): void;
  residual(x: Float64Array, sink: ResidualSink): void;
  /** current from a to b through the element */
  current(x: Float64Array): number;
}

// The linear elements are classes rather than closures: a sheet of 10⁴ resistors would otherwise
// make some 10⁵ function objects on every compile, and the garbage collector's time with them.

/** both ends on one net: nothing flows, nothing to solve */
const NO_ELEMENT: Element = { load() {}, residual() {}, current: () => 0 };

/** an ideal 0 Ω link, solved by its branch current k */
class LinkElement implements Element {
  constructor(
    private readonly a: number,
    private readonly b: number,
    private readonly k: number,
  ) {}
  load(s: Stamper): void {
    s.add(this.a, this.k, 1);
    s.add(this.b, this.k, -1);
    s.add(this.k, this.a, 1);
    s.add(this.k, this.b, -1);
  }
  residual(x: Float64Array, sink: ResidualSink): void {
    sink.add(this.a, x[this.k]);
    sink.add(this.b, -x[this.k]);
  }
  current(x: Float64Array): number {
    return x[this.k];
  }
}

class ConductanceElement implements Element {
  constructor(
    private readonly a: number,
    private readonly b: number,
    private readonly g: number,
  ) {}
  load(s: Stamper): void {
    s.conductance(this.a, this.b, this.g);
  }
  residual(x: Float64Array, sink: ResidualSink): void {
    const va = nodeV(x, this.a);
    const vb = nodeV(x, this.b);
    const i = this.g * (va - vb);
    const scale = this.g * (Math.abs(va) + Math.abs(vb));
    sink.add(this.a, i, scale);
    sink.add(this.b, -i, scale);
  }
  current(x: Float64Array): number {
    return this.g * (nodeV(x, this.a) - nodeV(x, this.b));
  }
}

/** `name` (for the branch unknown of a 0 Ω link) is only evaluated when one is needed. */
export function resistanceElement(a: number, b: number, r: number, alloc: Allocator, name: string | (() => string)): Element {
  if (a === b && isLink(r)) return NO_ELEMENT;
  if (isLink(r)) return new LinkElement(a, b, alloc.branch(typeof name === 'string' ? name : name()));
  return new ConductanceElement(a, b, 1 / r);
}

/** Topology edge for a resistance between pins 0 and 1. */
export function resistanceEdge(r: number, a = 0, b = 1): TopologyEdge {
  return isLink(r) ? { kind: 'voltage', a, b, value: 0, source: false } : { kind: 'resistive', a, b };
}

class ResistiveDevice implements Device {
  readonly nonlinear = false;
  readonly nodes: readonly number[];
  declare readonly report?: Device['report'];
  private readonly el: Element;
  constructor(
    readonly partId: string,
    pins: readonly number[],
    r: number,
    alloc: Allocator,
    report: Device['report'] | undefined,
  ) {
    this.el = resistanceElement(pins[0], pins[1], r, alloc, () => `${partId}:R`);
    const [a, b] = pins;
    this.nodes = a === GROUND ? (b === GROUND ? [] : [b]) : b === GROUND ? [a] : [a, b];
    if (report) (this as { report?: Device['report'] }).report = report;
  }
  load(s: Stamper, x: Float64Array): void {
    this.el.load(s, x);
  }
  residual(x: Float64Array, sink: ResidualSink): void {
    this.el.residual(x, sink);
  }
  pinCurrents(x: Float64Array): number[] {
    const i = this.el.current(x);
    return [i, -i];
  }
}

/** A linear two-pin part made of one resistance (resistor, NTC, LDR, switch, resistive load). */
export function resistiveDevice(partId: string, pins: readonly number[], r: number, alloc: Allocator, report?: Device['report']): Device {
  return new ResistiveDevice(partId, pins, r, alloc, report);
}

/**
 * A two-terminal junction (anode, cathode) with optional series resistance, Newton-linearised with
 * junction-voltage limiting. Used by the diode, Zener and LED models.
 */
export function junctionDevice(
  partId: string,
  pins: readonly number[],
  jp: JunctionParams,
  seriesResistance: number,
  alloc: Allocator,
  initialVoltage: number,
  report?: Device['report'],
): Device {
  const [an, ca] = pins;
  const j = !isLink(seriesResistance) ? alloc.internalNode(`${partId}:junction`) : an;
  const rs = !isLink(seriesResistance) ? resistanceElement(an, j, seriesResistance, alloc, `${partId}:Rs`) : null;
  let vold = 0;
  let cold = true;
  const nodes = [an, ca, ...(j !== an ? [j] : [])].filter((n) => n !== GROUND);
  return {
    partId,
    nonlinear: true,
    nodes,
    begin(x, start) {
      cold = start !== 'warm';
      if (!cold) vold = nodeV(x, j) - nodeV(x, ca);
    },
    load(s, x) {
      rs?.load(s, x);
      const vnew = nodeV(x, j) - nodeV(x, ca);
      let v: number;
      if (cold) {
        v = initialVoltage;
        cold = false;
        s.markLimited();
      } else {
        v = limitJunction(jp, vnew, vold);
        if (v !== vnew) s.markLimited();
      }
      vold = v;
      const { i, g } = junctionCurrent(jp, v, s.gmin);
      s.nonlinear([j, ca], [i, -i], [[j, ca, v]], [[g], [-g]]);
    },
    residual(x, sink, gmin) {
      rs?.residual(x, sink);
      const vj = nodeV(x, j);
      const vc = nodeV(x, ca);
      const { i, g } = junctionCurrent(jp, vj - vc, gmin);
      const scale = Math.abs(i) + g * (Math.abs(vj) + Math.abs(vc));
      sink.add(j, i, scale);
      sink.add(ca, -i, scale);
    },
    pinCurrents(x, gmin) {
      const i = rs ? rs.current(x) : junctionCurrent(jp, nodeV(x, an) - nodeV(x, ca), gmin).i;
      return [i, -i];
    },
    report(x, pv, pi) {
      const own = report?.(x, pv, pi) ?? {};
      const v = nodeV(x, j) - nodeV(x, ca);
      const beyond = v / jp.nvt > jp.lim.u || (jp.breakdown !== undefined && -(v + jp.breakdown.voltage) / jp.breakdown.slope > jp.breakdown.lim.u);
      if (!beyond) return own;
      return { ...own, warnings: [beyondModelWarning(partId, pi[0]), ...(own.warnings ?? [])] };
    },
  };
}

/**
 * A junction driven past the range where its exponential is followed exactly (see expLimitFor): the
 * numbers are then those of the linear continuation, not of the device law, and mean only "far too
 * much". Almost always an ideal source straight across the junction.
 */
export function beyondModelWarning(partId: string, current: number): DeviceWarning {
  return {
    code: 'junction_beyond_model',
    severity: 'danger',
    message: `${partId} is driven so hard that its junction equation no longer applies (${fmt(Math.abs(current), 'A')} reported; beyond ${fmt(JUNCTION_CURRENT_CEILING, 'A')} the exponential is continued linearly), so its current and voltage are not meaningful. It is probably straight across a supply: add a series resistor.`,
  };
}

/** Saturation currents the junction equations can represent (A): see expLimitFor in engine/junction. */
export const SATURATION_CURRENT_RANGE = { min: 1e-290, max: 1e6 } as const;

/**
 * Why a junction's saturation current at temperature cannot be used, or null. Far below 0 °C the
 * standard junction temperature equation sends I_S to 0 (an insulator), far above it beyond any real part; the
 * field named is the param to look at.
 */
export function saturationCurrentProblem(field: string, is: number, temperatureC: number): Array<[string, string]> {
  const { min, max } = SATURATION_CURRENT_RANGE;
  if (is >= min && is <= max) return [];
  const at = temperatureC === 25 ? '' : ` at ${temperatureC} °C`;
  return [
    [
      field,
      `gives a saturation current of ${Number.isFinite(is) ? is.toExponential(2) : String(is)} A${at}, outside the ${min.toExponential(0)} A to ${max.toExponential(0)} A the junction equations can represent. Check the value${at ? '; the semiconductor models are meant for about −55 °C to 150 °C (common practice for silicon parts)' : ''}`,
    ],
  ];
}

/**
 * The smallest voltage scale (V) an exponential may have: n·V_T, or a Zener's r_Z·I_ZT. Sharper,
 * one ulp of a node voltage moves the current by many e-folds and no iteration can settle.
 */
export const MIN_EXPONENTIAL_SCALE = 1e-12;

/** Why an exponential's voltage scale is too sharp to solve, or nothing. */
export function sharpnessProblem(field: string, scale: number, what: string): Array<[string, string]> {
  if (scale >= MIN_EXPONENTIAL_SCALE) return [];
  return [[field, `gives ${what} of ${scale.toExponential(2)} V, a sharper exponential than double-precision arithmetic can follow (at least ${MIN_EXPONENTIAL_SCALE} V); real parts are many orders of magnitude softer`]];
}

/**
 * Largest source voltage (V), current (A) or load power (W) the solve accepts. Beyond, the
 * rounding of the huge values swamps every ordinary part beside them (a 1e200 A source made a 1 V
 * source elsewhere read 0 V), and Tapline is for DC networks, not for astronomy.
 */
export const SOURCE_LIMIT = 1e12;

/** Why a source or load value is beyond SOURCE_LIMIT, or nothing. */
export function sourceLimitProblem(field: string, value: number, unit: string): Array<[string, string]> {
  if (Math.abs(value) <= SOURCE_LIMIT) return [];
  return [[field, `is ${value} ${unit}, beyond the ±${SOURCE_LIMIT} ${unit} the solver can hold beside ordinary parts; check the value and its unit (plain SI units: volts, amperes, watts)`]];
}

/** Power-rating warnings: danger above the rating, caution above 50 % of it. */
export function powerRatingWarnings(partLabel: string, power: number, rating: number, what = 'dissipates'): DeviceWarning[] {
  if (power > rating)
    return [
      {
        code: 'power_over_rating',
        severity: 'danger',
        message: `${partLabel} ${what} ${fmt(power, 'W')}, above its ${fmt(rating, 'W')} rating. Use a part with a higher power rating, or reduce the voltage across it.`,
      },
    ];
  if (power > 0.5 * rating)
    return [
      {
        code: 'power_above_derating',
        severity: 'caution',
        message: `${partLabel} ${what} ${fmt(power, 'W')}, more than 50 % of its ${fmt(rating, 'W')} rating. Common practice derates to 50 %: consider a part rated ${fmt(2 * power, 'W')} or more.`,
      },
    ];
  return [];
}

const PREFIXES: Array<[number, string]> = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

/** Compact engineering formatting for messages (the editor has its own formatter in shared/units). */
export function fmt(v: number, unit: string): string {
  if (!Number.isFinite(v)) return `${v} ${unit}`;
  if (v === 0) return `0 ${unit}`;
  const a = Math.abs(v);
  for (const [f, p] of PREFIXES) {
    if (a >= f * 0.9995) return `${Number((v / f).toPrecision(3))} ${p}${unit}`;
  }
  return `${v.toExponential(2)} ${unit}`;
}
