// The cloud implementation of the editor's SheetSource (src/editor/sheetSource.ts): a project's
// sheet loaded and saved through the API (PATCH with baseVersion) until live co-editing replaces
// the save path; plus read-only sources for share links and saved revisions.
import { MutationObserver, QueryClient } from '@tanstack/react-query';
import { parseSheet } from '../../shared/sheet/parse';
import type { LoadedSheet, SaveMeta, SaveResult, SheetSource } from '../editor/sheetSource';
import { ApiError } from '../lib/api';
import { queryKeys } from '../lib/queryKeys';
import { endpoints } from './endpoints';
import { LIVE_AUTOSAVE_DELAY_MS, liveSaveFor } from '../collab/liveSessions';
import { storeProject } from './projectQueries';
import type { ProjectDetail } from './types';

function readable(raw: unknown, what: string): LoadedSheet['sheet'] {
  const r = parseSheet(raw);
  if (!r.ok) throw new Error(`${what} holds a sheet this version of Tapline cannot read: ${r.error.message}`);
  return r.sheet;
}

/** Turns a refused save into a message the editor can show as is. */
export function saveErrorMessage(e: unknown): string {
  if (!(e instanceof ApiError)) return e instanceof TypeError ? 'Not saved: the server could not be reached. Your edits stay in this tab; saving resumes when you are back online.' : String(e);
  switch (e.status) {
    case 401: return 'Not saved: you are signed out. Sign in again in another tab, then save (your edits stay in this tab).';
    case 403: return 'Not saved: you can no longer edit this project (ask an owner for the editor role).';
    case 404: return 'Not saved: this project was deleted or you were removed from it. Export the sheet from the menu to keep your work.';
    case 409: return `Not saved: someone else saved this project meanwhile (it is now at version ${String(e.body.currentVersion ?? '?')}). Reload to get their change, then redo yours.`;
    default: return `Not saved: ${e.message}`;
  }
}

/** Pause after the last edit before a sheet not edited live is PATCHed, ms. */
const REST_AUTOSAVE_DELAY_MS = 1200;

/** A cloud project as a sheet source: viewers get it read-only; editors and owners save to it. */
export function createCloudSheetSource(projectId: string, qc: QueryClient): SheetSource {
  // A viewer's copy has no save at all, so the editor shows it as a read-only source.
  let readOnly = false;
  const save = async (sheet: LoadedSheet['sheet'], meta: SaveMeta): Promise<SaveResult> => {
    // Edited live (src/collab): every change already goes to the server as an operation.
    const live = liveSaveFor(projectId);
    if (live) return live();
    const observer = new MutationObserver<ProjectDetail, unknown, { baseVersion: number }>(qc, {
      mutationKey: ['projects', 'save', projectId],
      mutationFn: ({ baseVersion }) => endpoints.patchProject(projectId, { sheet, baseVersion }),
      onSuccess: (p) => storeProject(qc, p),
    });
    const cached = qc.getQueryData<ProjectDetail>(queryKeys.projects.detail(projectId));
    const baseVersion = meta.baseVersion !== undefined ? Number(meta.baseVersion) : cached?.version;
    if (baseVersion === undefined || !Number.isInteger(baseVersion)) throw new Error('Not saved: the sheet was not loaded from the server. Reload the page.');
    try {
      const p = await observer.mutate({ baseVersion });
      return { version: p.version };
    } catch (e) {
      throw new Error(saveErrorMessage(e));
    }
  };
  return {
    key: `cloud-${projectId}`,
    // read at every edit: a sheet joined live saves as soon as the server has acknowledged it
    get autosaveDelayMs() {
      return liveSaveFor(projectId) ? LIVE_AUTOSAVE_DELAY_MS : REST_AUTOSAVE_DELAY_MS;
    },
    get save() {
      return readOnly ? undefined : save;
    },
    // The caller's signal only tells us the result is no longer wanted (the editor ignores it);
    // it must not abort the shared query fetch, which a remount (React StrictMode runs effects
    // twice in development) joins instead of starting anew.
    async load() {
      const p = await qc.fetchQuery({
        queryKey: queryKeys.projects.detail(projectId),
        queryFn: ({ signal: s }) => endpoints.getProject(projectId, s),
        staleTime: 0,
      });
      readOnly = p.role === 'viewer';
      return {
        sheet: readable(p.sheet, `Project “${p.title}”`),
        readOnly,
        title: p.title,
        version: p.version,
        notice: readOnly ? 'Cloud project, view only: you can solve it; ask an owner for the editor role to change it.' : `Cloud project · your role: ${p.role} · saved to the server as you edit`,
      };
    },
  };
}

/** A project shared by link: read-only, no sign-in needed. */
export function createSharedSheetSource(token: string, qc: QueryClient): SheetSource {
  return {
    key: `shared-${token}`,
    async load() {
      const s = await qc.fetchQuery({ queryKey: queryKeys.shared(token), queryFn: ({ signal: sg }) => endpoints.getShared(token, sg), staleTime: 0 });
      return { sheet: readable(s.sheet, `Shared project “${s.title}”`), readOnly: true, title: s.title, version: s.version, notice: 'Shared read-only link: you can solve this sheet but not change it.' };
    },
  };
}

/** One saved revision of a project, read-only (restore it from the project's settings). */
export function createRevisionSheetSource(projectId: string, revId: string, qc: QueryClient): SheetSource {
  return {
    key: `rev-${projectId}_${revId}`,
    async load() {
      const r = await qc.fetchQuery({ queryKey: queryKeys.projects.revision(projectId, revId), queryFn: ({ signal: sg }) => endpoints.getRevision(projectId, revId, sg) });
      return {
        sheet: readable(r.sheet, `Revision “${r.label}”`),
        readOnly: true,
        title: r.label,
        version: r.projectVersion,
        notice: `Saved revision (project version ${r.projectVersion}), read-only. Restore it from the project’s settings.`,
      };
    },
  };
}
