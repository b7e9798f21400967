import { bandFactory } from './band';
import { denseFactory } from './dense';
import type { LinearSolverKind, LinearSystem } from './types';

export * from './types';
export { DenseSystem, denseFactory } from './dense';
export { BandSystem, bandFactory, reverseCuthillMcKee } from './band';

/** Above this many unknowns 'auto' picks the band solver. */
export const DENSE_LIMIT = 150;

export function createLinearSystem(
  kind: LinearSolverKind,
  size: number,
  pattern: ReadonlyArray<readonly [number, number]>,
): LinearSystem {
  if (kind === 'dense' || (kind === 'auto' && size <= DENSE_LIMIT)) return denseFactory.create(size, pattern);
  return bandFactory.create(size, pattern);
}
