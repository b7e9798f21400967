import { parseSheet } from '../../shared/sheet/parse';
import { SHEET_FORMAT, SHEET_VERSION } from '../../shared/sheet/schema';
import { HttpError } from '../http-errors';
import { findUnstorable } from './storable-json';

/**
 * Checks a sheet with the engine's own parser and returns it as sent (defaults are not baked in,
 * so what was saved is what is exported). A bad sheet is 400 `invalid_sheet` with every issue;
 * so is one the database could not store verbatim (NUL, broken Unicode, Infinity, deep nesting).
 */
export function validateSheet(input: unknown, field = 'sheet'): Record<string, unknown> {
  // First: parseSheet and the jsonb column both assume a document they can walk and store.
  const unstorable = findUnstorable(input);
  if (unstorable) {
    const at = unstorable.path ? `${field}.${unstorable.path}` : field;
    throw new HttpError(400, 'invalid_sheet', `Sheet: ${unstorable.message}`, at, { issues: [{ path: unstorable.path, message: unstorable.message }] });
  }
  const r = parseSheet(input);
  if (r.ok) return input as Record<string, unknown>;
  const first = r.error.issues[0];
  throw new HttpError(400, 'invalid_sheet', r.error.message, first?.path ? `${field}.${first.path}` : field, { issues: r.error.issues });
}

/** An empty version 1 sheet, for a project created without one. */
export function emptySheet(title: string): Record<string, unknown> {
  return { format: SHEET_FORMAT, version: SHEET_VERSION, title, conditions: { temperatureC: 25, illuminanceLux: 100 }, parts: [], wires: [] };
}
