// The sources that need no account: the local sheet and the examples. Registered first.
import { registerSheetSourceResolver } from '../sheetSource';
import { exampleSource } from './exampleSources';
import { localSource } from './localSource';

let registered = false;

/** Idempotent: safe to call from every page that opens sheets. */
export function registerBuiltinSources(): void {
  if (registered) return;
  registered = true;
  registerSheetSourceResolver((id) => (id === 'local' ? localSource : null));
  registerSheetSourceResolver(exampleSource);
}
