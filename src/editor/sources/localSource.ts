// The browser-local sheet at /sheets/local, kept in localStorage. Saving an example lands here.
import { parseSheetJson, type Sheet } from '../../../shared/sheet';
import type { SheetSource } from '../sheetSource';

export const LOCAL_KEY = 'tapline.sheet.local';
/** The local sheet as it was before an example replaced it (one level of safety net). */
export const LOCAL_PREVIOUS_KEY = 'tapline.sheet.local.previous';

export function blankSheet(title = 'Local sheet'): Sheet {
  return { format: 'tapline.sheet', version: 1, title, conditions: { temperatureC: 25, illuminanceLux: 100 }, parts: [], wires: [] };
}

/** Write a sheet to the local slot; when `replacing`, keep what was there as the previous copy. */
export function writeLocalSheet(sheet: Sheet, replacing = false): void {
  if (replacing) {
    const old = localStorage.getItem(LOCAL_KEY);
    if (old) localStorage.setItem(LOCAL_PREVIOUS_KEY, old);
  }
  try {
    localStorage.setItem(LOCAL_KEY, JSON.stringify(sheet));
  } catch (e) {
    throw new Error(
      `The browser refused to store the sheet (${e instanceof Error ? e.name : 'storage error'}). Free some site storage or export the sheet as a file.`,
    );
  }
}

export const localSource: SheetSource = {
  key: 'local',
  async load() {
    const text = localStorage.getItem(LOCAL_KEY);
    if (!text) return { sheet: blankSheet(), readOnly: false, title: 'Local sheet' };
    const r = parseSheetJson(text);
    if (!r.ok) {
      // keep the unreadable copy so nothing is lost, and start clean
      localStorage.setItem(`${LOCAL_KEY}.unreadable`, text);
      return {
        sheet: blankSheet(),
        readOnly: false,
        title: 'Local sheet',
        notice: `The saved local sheet could not be read (${r.error.message}); it was set aside and a blank sheet opened.`,
      };
    }
    return { sheet: r.sheet, readOnly: false, title: r.sheet.title || 'Local sheet' };
  },
  async save(sheet) {
    writeLocalSheet(sheet);
    return {};
  },
  autosaveDelayMs: 500,
};
