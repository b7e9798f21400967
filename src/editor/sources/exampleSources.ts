// The demo sheets in examples/*.json, at /sheets/example-<file-name>. Opening one gives an
// editable copy; the first save writes it to the local sheet and the editor moves to /sheets/local.
import { parseSheet } from '../../../shared/sheet';
import type { SheetSource } from '../sheetSource';
import { writeLocalSheet } from './localSource';

const files = import.meta.glob('../../../examples/*.json', { eager: true, import: 'default' }) as Record<string, unknown>;

export interface ExampleInfo {
  /** file name without .json: "battery-divider" */
  name: string;
  title: string;
  description?: string;
  routeId: string;
}

function nameOf(path: string): string {
  return path.slice(path.lastIndexOf('/') + 1).replace(/\.json$/, '');
}

/** Every bundled example, by title. */
export function listExamples(): ExampleInfo[] {
  return Object.entries(files)
    .map(([path, data]) => {
      const d = data as { title?: string; description?: string };
      const name = nameOf(path);
      return { name, title: d.title ?? name, description: d.description, routeId: `example-${name}` };
    })
    .sort((a, b) => a.title.localeCompare(b.title));
}

/** The source for /sheets/example-<name>, or null when there is no such example. */
export function exampleSource(routeId: string): SheetSource | null {
  if (!routeId.startsWith('example-')) return null;
  const name = routeId.slice('example-'.length);
  const entry = Object.entries(files).find(([path]) => nameOf(path) === name);
  if (!entry) return null;
  return {
    key: routeId,
    async load() {
      const r = parseSheet(entry[1]);
      if (!r.ok) throw new Error(`The example "${name}" is not a valid sheet: ${r.error.message}`);
      return {
        sheet: r.sheet,
        readOnly: false,
        title: r.sheet.title ?? name,
        // short enough for the toolbar at 1024 px; the backup is mentioned when it happens
        notice: 'Example (demo data): editing saves it as your local sheet.',
      };
    },
    async save(sheet) {
      writeLocalSheet(sheet, true);
      return { continueAt: '/sheets/local' };
    },
    autosaveDelayMs: 500,
  };
}
