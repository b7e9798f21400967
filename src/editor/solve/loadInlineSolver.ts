// The engine for inline solves is its own chunk, loaded after the editor opens: the first
// solves go to the worker meanwhile, and pages that never solve never download it.
import { createInlineSolver, type InlineSolver } from './inlineSolver';

/** An inline solver once the engine module has loaded. */
export async function loadInlineSolver(): Promise<InlineSolver> {
  const engine = await import('../../../shared/engine');
  return createInlineSolver(engine);
}
