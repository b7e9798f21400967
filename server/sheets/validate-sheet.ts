import { parseSheet } from '../../shared/sheet/parse';
import { SHEET_FORMAT, SHEET_VERSION } from '../../shared/sheet/schema';
import { HttpError } from '../http-errors';

/**
 * Checks a sheet with the engine's own parser and returns it as sent (defaults are not baked in,
 * so what was saved is what is exported). A bad sheet is 400 `invalid_sheet` with every issue.
 */
export function validateSheet(input: unknown, field = 'sheet'): Record<string, unknown> {
  const r = parseSheet(input);
  if (r.ok) return input as Record<string, unknown>;
  const first = r.error.issues[0];
  throw new HttpError(400, 'invalid_sheet', r.error.message, first?.path ? `${field}.${first.path}` : field, { issues: r.error.issues });
}

/** An empty version 1 sheet, for a project created without one. */
export function emptySheet(title: string): Record<string, unknown> {
  return { format: SHEET_FORMAT, version: SHEET_VERSION, title, conditions: { temperatureC: 25, illuminanceLux: 100 }, parts: [], wires: [] };
}
