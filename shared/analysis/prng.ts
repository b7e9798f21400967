// Seeded random numbers for Monte Carlo. The generator is xoroshiro128+ (D. Blackman and S. Vigna,
// "Scrambled linear pseudorandom number generators", ACM TOMS 47(4), 2021), from the pure-rand
// package. Sample i draws from its own substream: the base generator advanced by i jumps of 2⁶⁴
// steps (the generator's jump function, designed for parallel streams). So a sample's values depend
// only on (seed, i) — any split of the samples into chunks or workers gives the same numbers.
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import type { JumpableRandomGenerator } from 'pure-rand/types/JumpableRandomGenerator';

/** One sample's random stream. */
export class RandomStream {
  constructor(private readonly g: JumpableRandomGenerator) {}

  /** uniform on [0, 1), 53 random bits */
  uniform(): number {
    return uniformFloat64(this.g);
  }

  /**
   * Standard normal by the Box–Muller transform (G. E. P. Box and M. E. Muller, Ann. Math. Statist.
   * 29(2), 610–611, 1958); two uniforms per value, so a sample's draws stay in step.
   */
  normal(): number {
    const u1 = 1 - this.uniform(); // (0, 1]: log is finite
    const u2 = this.uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  }
}

/** The seed as the generator takes it: a 32-bit integer (higher bits are folded in, not dropped). */
export function normalizeSeed(seed: number): number {
  if (!Number.isFinite(seed)) throw new Error(`the Monte Carlo seed must be a finite integer (got ${seed})`);
  const s = Math.trunc(seed);
  const hi = Math.floor(s / 2 ** 32);
  return (s ^ Math.imul(hi, 0x9e3779b1)) | 0;
}

/** Streams for samples first, first+1, … of one seed. */
export class SampleStreams {
  private readonly g: JumpableRandomGenerator;

  constructor(seed: number, firstSample = 0) {
    if (!(Number.isInteger(firstSample) && firstSample >= 0)) throw new Error(`first sample index must be a whole number ≥ 0 (got ${firstSample})`);
    this.g = xoroshiro128plus(normalizeSeed(seed));
    for (let i = 0; i < firstSample; i++) this.g.jump();
  }

  /** the stream of the next sample */
  next(): RandomStream {
    const s = new RandomStream(this.g.clone());
    this.g.jump();
    return s;
  }
}
