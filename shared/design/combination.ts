/** Ways of joining preferred-value parts into one resistance, and the resistance each gives. */

/**
 * How the parts are joined. For three parts: `series3` a + b + c, `parallel3` a ∥ b ∥ c,
 * `series-parallel` a + (b ∥ c), `parallel-series` a ∥ (b + c).
 */
export type Topology = 'single' | 'series' | 'parallel' | 'series3' | 'parallel3' | 'series-parallel' | 'parallel-series';

export const TOPOLOGIES_BY_PARTS: Readonly<Record<1 | 2 | 3, readonly Topology[]>> = {
  1: ['single'],
  2: ['single', 'series', 'parallel'],
  3: ['single', 'series', 'parallel', 'series3', 'parallel3', 'series-parallel', 'parallel-series'],
};

export interface ValueMatch {
  readonly topology: Topology;
  /** Part values in ohms, in the order the topology's formula names them. */
  readonly parts: readonly number[];
  /** The combined resistance, ohms. */
  readonly value: number;
  /** Signed relative error (value − target) / target: 0.01 means 1 % high. */
  readonly error: number;
  /** How to build it, in RKM: "4K7 + 1K0", "10K ∥ 22K", "1K0 + (10K ∥ 22K)". */
  readonly expression: string;
}

const par = (a: number, b: number) => (a * b) / (a + b);

/** The resistance (ohms) of `parts` (ohms) joined as `topology`. */
export function combinedResistance(topology: Topology, parts: readonly number[]): number {
  const [a, b, c] = parts;
  switch (topology) {
    case 'single':
      return a;
    case 'series':
      return a + b;
    case 'parallel':
      return par(a, b);
    case 'series3':
      return a + b + c;
    case 'parallel3':
      return 1 / (1 / a + 1 / b + 1 / c);
    case 'series-parallel':
      return a + par(b, c);
    case 'parallel-series':
      return par(a, b + c);
  }
}
