// The sheet's own files: the sheet file (JSON, the format in docs and contracts) and the parts list.
import { partsList, partsListCsv } from '../../../../shared/design';
import type { Sheet } from '../../../../shared/sheet';

/** The sheet file, pretty-printed, without editor-only wire ids (they are layout, regenerated on load). */
export function sheetJson(sheet: Sheet): string {
  return `${JSON.stringify(sheet, null, 2)}\n`;
}

/** Parts-list CSV (RFC 4180, CRLF) of the sheet. */
export function partsListCsvOf(sheet: Sheet): string {
  return partsListCsv(partsList(sheet));
}
