/**
 * The parts list as CSV (RFC 4180: comma-separated, CRLF line ends, fields with commas, quotes
 * or line breaks quoted and inner quotes doubled), written by papaparse.
 */
import Papa from 'papaparse';
import { formatTolerance } from '../units/format';
import { formatEng } from '../units/engineering';
import type { PartsListRow } from './parts-list';

/** Column headings, in order. */
export const PARTS_LIST_COLUMNS = ['Designators', 'Quantity', 'Type', 'Value', 'RKM', 'Tolerance', 'Power rating'] as const;

/**
 * CSV text for `rows`, with a heading line. Designators are joined with ", " (so that field is
 * quoted). Fields a spreadsheet would run as a formula (starting =, +, -, @) are prefixed with
 * an apostrophe, since part ids are free text from the sheet file.
 */
export function partsListCsv(rows: readonly PartsListRow[]): string {
  const data = rows.map((r) => [
    r.designators.join(', '),
    String(r.quantity),
    r.typeLabel,
    r.value,
    r.valueRkm ?? '',
    r.tolerance === null ? '' : formatTolerance(r.tolerance),
    r.powerRating === null ? '' : formatEng(r.powerRating, 'W'),
  ]);
  return Papa.unparse({ fields: [...PARTS_LIST_COLUMNS], data }, { newline: '\r\n', quotes: false, escapeFormulae: true });
}
