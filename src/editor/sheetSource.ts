// Where the editor's sheet comes from and goes to. The editor only ever talks to this interface:
// the browser-local sheet, the bundled examples and (in src/cloud/) the server each implement it.
import type { Sheet } from '../../shared/sheet';

/** What a source hands the editor when it opens a sheet. */
export interface LoadedSheet {
  /** a valid, defaults-filled sheet (run it through parseSheet before returning it) */
  sheet: Sheet;
  /** true when this user may look but not edit (the editor disables every document change) */
  readOnly: boolean;
  /** shown in the editor's title bar */
  title: string;
  /** the source's revision of this sheet, if it keeps them (cloud); handed back on save */
  version?: number | string;
  /** a short note shown under the title, e.g. "Example — your edits are saved as your local sheet" */
  notice?: string;
}

/** What the editor tells a source when it saves. */
export interface SaveMeta {
  title: string;
  /** the version the edit was based on (from load or the previous save) */
  baseVersion?: number | string;
  /** 'autosave' after a pause in editing; 'explicit' when the user asked (Ctrl+S) */
  reason: 'autosave' | 'explicit';
}

export interface SaveResult {
  /** the new version, when the source keeps versions */
  version?: number | string;
  /** when saving moved the sheet elsewhere (an example is saved as the local sheet), the route to continue at */
  continueAt?: string;
}

/**
 * A place sheets live. `save` is absent for sources that cannot store (the editor then never
 * autosaves). Errors thrown by `load`/`save` should be `Error`s whose message a user can act on
 * ("You are signed out — sign in to save this sheet"), because the editor shows them verbatim.
 */
export interface SheetSource {
  /** stable key of this source + sheet, e.g. "local", "example-divider", "cloud-<uuid>" */
  readonly key: string;
  load(signal?: AbortSignal): Promise<LoadedSheet>;
  save?(sheet: Sheet, meta: SaveMeta): Promise<SaveResult>;
  /** ms of quiet after the last edit before an autosave; default 600; 0 disables autosave */
  readonly autosaveDelayMs?: number;
}

/**
 * Maps the `:id` of `/sheets/:id` to a source, or returns null when the id is not this
 * resolver's. Resolvers are asked in registration order and the first match wins; the ids
 * "local" and "example-<name>" belong to the built-in sources (src/editor/sources/).
 */
export type SheetSourceResolver = (routeId: string) => SheetSource | null;

const resolvers: SheetSourceResolver[] = [];

/** Add a resolver (the cloud module registers one for its sheet ids). Returns an unregister function. */
export function registerSheetSourceResolver(resolver: SheetSourceResolver): () => void {
  resolvers.push(resolver);
  return () => {
    const i = resolvers.indexOf(resolver);
    if (i >= 0) resolvers.splice(i, 1);
  };
}

/** The source for a route id, or null when no resolver knows it (the page shows "not found"). */
export function resolveSheetSource(routeId: string): SheetSource | null {
  for (const r of resolvers) {
    const s = r(routeId);
    if (s) return s;
  }
  return null;
}
