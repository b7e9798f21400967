// /sheets/:id/report and /projects/:id/report: the printable design report. The sheet is the one
// the editor last handed over in this tab (so unsaved edits are in it), else loaded from its source.
import { useEffect, useState } from 'react';
import { useLocation, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { bindCloudQueryClient } from '../cloud/registerCloudSources';
import { parseSheet, type Sheet } from '../../shared/sheet';
import { resolveSheetSource } from '../editor/sheetSource';
import { registerBuiltinSources } from '../editor/sources/builtinSources';
import { peekToolSession } from '../editor/tools/results/toolSession';
import { ReportView } from '../report/ReportView';

registerBuiltinSources();

type State = { kind: 'loading' } | { kind: 'error'; message: string } | { kind: 'ready'; sheet: Sheet };

export function ReportPage() {
  // a cloud sheet's source loads through the app's query client
  bindCloudQueryClient(useQueryClient());
  const { id = 'local' } = useParams();
  const { pathname } = useLocation();
  const backTo = pathname.replace(/\/report\/?$/, '');
  const session = peekToolSession(id);
  const [state, setState] = useState<State>(() => (session?.sheet ? { kind: 'ready', sheet: session.sheet } : { kind: 'loading' }));
  useEffect(() => {
    if (state.kind !== 'loading') return;
    const source = resolveSheetSource(id);
    if (!source) return setState({ kind: 'error', message: `There is no sheet "${id}" to report on. Open it in the editor first.` });
    const abort = new AbortController();
    source.load(abort.signal).then(
      (l) => {
        const r = parseSheet(l.sheet);
        if (!abort.signal.aborted) setState(r.ok ? { kind: 'ready', sheet: r.sheet } : { kind: 'error', message: r.error.message });
      },
      (e: unknown) => !abort.signal.aborted && setState({ kind: 'error', message: e instanceof Error ? e.message : String(e) }),
    );
    return () => abort.abort();
  }, [id, state.kind]);
  useEffect(() => {
    const t = state.kind === 'ready' ? state.sheet.title : undefined;
    document.title = t ? `${t} — design report` : 'Design report — Tapline';
  }, [state]);
  if (state.kind === 'loading') return <p className="p-6 text-ink-muted" role="status">Preparing the report…</p>;
  if (state.kind === 'error') return <p className="p-6" role="alert">{state.message}</p>;
  return (
    <div className="h-full overflow-auto">
      <ReportView sheet={state.sheet} session={session} backTo={backTo} />
    </div>
  );
}
