import { sparseLuFactory } from '../../linalg/mna-system';
import { bandFactory } from './band';
import { denseFactory } from './dense';
import type { LinearSolverKind, LinearSystem, LinearSystemFactory } from './types';

export * from './types';
export { DenseSystem, denseFactory } from './dense';
export { BandSystem, bandFactory, reverseCuthillMcKee } from './band';

/** Above this many unknowns 'auto' leaves the dense LU for the sparse one. */
export const DENSE_LIMIT = 150;

/**
 * 'dense': ml-matrix LU; 'band': band LU after RCM ordering; 'sparse': the sparse LU of
 * shared/linalg (AMD ordering, symbolic analysis kept across solves); 'auto': dense up to
 * DENSE_LIMIT unknowns, sparse above. A LinearSystemFactory may be passed instead of a kind.
 */
export function createLinearSystem(
  kind: LinearSolverKind | LinearSystemFactory,
  size: number,
  pattern: ReadonlyArray<readonly [number, number]>,
): LinearSystem {
  if (typeof kind === 'object') return kind.create(size, pattern);
  if (kind === 'dense' || (kind === 'auto' && size <= DENSE_LIMIT)) return denseFactory.create(size, pattern);
  if (kind === 'band') return bandFactory.create(size, pattern);
  return sparseLuFactory.create(size, pattern);
}
