// Registers the cloud sheet sources with the editor's resolver registry (import for the effect).
// The resolver needs the app's QueryClient so the editor and the project pages share one cache;
// `bindCloudQueryClient` hands it over (called while the layout renders, before any sheet page).
import { QueryClient } from '@tanstack/react-query';
import { registerSheetSourceResolver } from '../editor/sheetSource';
import { createCloudSheetSource, createRevisionSheetSource, createSharedSheetSource } from './cloudSheetSource';
import { parseCloudRouteId } from './routeIds';

let client: QueryClient | null = null;

export function bindCloudQueryClient(qc: QueryClient): void {
  client = qc;
}

function queryClient(): QueryClient {
  client ??= new QueryClient();
  return client;
}

registerSheetSourceResolver((routeId) => {
  const id = parseCloudRouteId(routeId);
  if (!id) return null;
  if (id.kind === 'project') return createCloudSheetSource(id.projectId, queryClient());
  if (id.kind === 'revision') return createRevisionSheetSource(id.projectId, id.revId, queryClient());
  return createSharedSheetSource(id.token, queryClient());
});
