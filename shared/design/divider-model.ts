/**
 * Closed-form model of a two-resistor divider: R1 (top) from the supply to the tap, R2 (bottom)
 * from the tap to ground, and a load on the tap. Volts, ohms, amperes throughout.
 *
 * Output (Thevenin: V_th = V·R2/(R1+R2), R_th = R1∥R2; references.md, divider loading):
 *   no load         V_out = V·R2/(R1+R2)
 *   resistance R_L  V_out = V_th·R_L/(R_th+R_L) = V·(R2∥R_L)/(R1 + R2∥R_L)
 *   current I_L     V_out = V_th − I_L·R_th      (I_L drawn out of the tap, ≥ 0)
 */

/** What the tap feeds. A current load is the current it draws out of the tap (A, ≥ 0). */
export type DividerLoad =
  | { readonly kind: 'none' }
  | { readonly kind: 'resistance'; readonly ohms: number }
  | { readonly kind: 'current'; readonly amps: number };

export const NO_LOAD: DividerLoad = Object.freeze({ kind: 'none' });

const par = (a: number, b: number) => (a * b) / (a + b);

/** R1 ∥ R2, ohms: the source resistance the load (or an ADC input) sees at the tap. */
export function theveninResistance(r1: number, r2: number): number {
  return par(r1, r2);
}

/** The tap voltage (V) for supply `v` (V), top `r1` and bottom `r2` (Ω) and the load. */
export function dividerOutput(v: number, r1: number, r2: number, load: DividerLoad = NO_LOAD): number {
  switch (load.kind) {
    case 'none':
      return (v * r2) / (r1 + r2);
    case 'resistance': {
      const bottom = par(r2, load.ohms);
      return (v * bottom) / (r1 + bottom);
    }
    case 'current':
      return (v * r2 - load.amps * r1 * r2) / (r1 + r2);
  }
}

/**
 * The top resistor (Ω) that puts the tap at `vOut` for bottom `r2`, or null when none can
 * (vOut outside (0, v), or a current load too heavy for this r2).
 */
export function topForOutput(v: number, vOut: number, r2: number, load: DividerLoad = NO_LOAD): number | null {
  if (!(vOut > 0 && vOut < v)) return null;
  switch (load.kind) {
    case 'none':
      return (r2 * (v - vOut)) / vOut;
    case 'resistance':
      return (par(r2, load.ohms) * (v - vOut)) / vOut;
    case 'current': {
      // vOut(R1 + R2) = v·R2 − I·R1·R2  ⇒  R1 = R2(v − vOut)/(vOut + I·R2)
      return (r2 * (v - vOut)) / (vOut + load.amps * r2);
    }
  }
}

/** The bottom resistor (Ω) that puts the tap at `vOut` for top `r1`, or null when none can. */
export function bottomForOutput(v: number, vOut: number, r1: number, load: DividerLoad = NO_LOAD): number | null {
  if (!(vOut > 0 && vOut < v)) return null;
  const parallelBottom = (r1 * vOut) / (v - vOut);
  switch (load.kind) {
    case 'none':
      return parallelBottom;
    case 'resistance':
      // R2 ∥ R_L = P  ⇒  R2 = P·R_L/(R_L − P); impossible when the load alone is below P.
      return parallelBottom < load.ohms ? (parallelBottom * load.ohms) / (load.ohms - parallelBottom) : null;
    case 'current': {
      // vOut(R1 + R2) = v·R2 − I·R1·R2  ⇒  R2 = vOut·R1/(v − vOut − I·R1)
      const d = v - vOut - load.amps * r1;
      return d > 0 ? (vOut * r1) / d : null;
    }
  }
}

export interface OutputWindow {
  /** Lowest and highest tap voltage, V. */
  readonly min: number;
  readonly max: number;
}

/**
 * Exact worst-case tap voltage over R1 ∈ r1·[1−t1, 1+t1], R2 ∈ r2·[1−t2, 1+t2] and the supply
 * in [vMin, vMax], by evaluating the eight corners.
 *
 * Why corners suffice: with the other two fixed, V_out is monotonic in each variable — in V it is
 * affine; in R1 and in R2 it is a ratio (a·x + b)/(c·x + d) of affine functions (for every load
 * kind above), which has no interior extremum. A function monotonic in each coordinate on a box
 * takes its maximum and minimum at vertices: from any point, moving one coordinate to its better
 * end never makes things worse, and after three moves the point is a vertex. (For no load or a
 * resistive load the directions are fixed: V_out rises with V and R2 and falls with R1, so the
 * extremes are V_max·R2(1+t2)/(R1(1−t1)+R2(1+t2)) and its mirror, as in references.md.)
 */
export function outputWindow(
  supply: { readonly min: number; readonly max: number },
  r1: number,
  r2: number,
  t1: number,
  t2: number,
  load: DividerLoad = NO_LOAD,
): OutputWindow {
  let min = Infinity;
  let max = -Infinity;
  for (const v of [supply.min, supply.max]) {
    for (const a of [r1 * (1 - t1), r1 * (1 + t1)]) {
      for (const b of [r2 * (1 - t2), r2 * (1 + t2)]) {
        const out = dividerOutput(v, a, b, load);
        if (out < min) min = out;
        if (out > max) max = out;
      }
    }
  }
  return { min, max };
}

/** The current (A) the supply delivers into R1 at supply `v`, load included. */
export function supplyCurrent(v: number, r1: number, r2: number, load: DividerLoad = NO_LOAD): number {
  return (v - dividerOutput(v, r1, r2, load)) / r1;
}
