// Before a sheet opens: lay out parts the file left without positions, ordering the rows by a
// first solve's net voltages (through a short-lived solver worker, off the main thread).
import type { Sheet } from '../../../shared/sheet';
import { layoutMissingPositions } from './autoLayout';
import type { SolverHandle } from '../solve/latestWins';

export async function prepareSheet(sheet: Sheet, makeHandle: () => SolverHandle): Promise<Sheet> {
  if (sheet.parts.every((p) => p.position)) return sheet;
  const handle = makeHandle();
  try {
    const r = await handle.port.solve(sheet);
    return layoutMissingPositions(sheet, r.ok ? r.nets : undefined);
  } catch {
    return layoutMissingPositions(sheet);
  } finally {
    handle.dispose();
  }
}
