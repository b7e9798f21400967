// The editor screen for one sheet source: loads it, makes the editor and its live solve, lays out
// toolbar, palette, canvas, inspector and status bar, and keeps the sheet saved.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { ReactFlowProvider } from '@xyflow/react';
import '@xyflow/react/dist/base.css';
import './editor.css';
import { EditorContext } from './EditorContext';
import { createEditor, type Editor } from './store/actions';
import { startLiveSolve, type LiveSolve } from './solve/liveSolve';
import { startSolverWorker } from './solve/workerHandle';
import { loadInlineSolver } from './solve/loadInlineSolver';
import { resolveSheetSource, type LoadedSheet, type SheetSource } from './sheetSource';
import { prepareSheet } from './sources/prepareSheet';
import { SchematicCanvas } from './canvas/SchematicCanvas';
import { Palette } from './panels/Palette';
import { RightPanel } from './panels/RightPanel';
import { Toolbar } from './panels/Toolbar';
import { StatusBar } from './panels/StatusBar';
import { ShortcutHelp } from './panels/ShortcutHelp';
import { CanvasBanner } from './panels/CanvasBanner';
import { useEditorShortcuts } from './keyboard/useEditorShortcuts';
import { useAutosave } from './useAutosave';
import { useEditorUi } from './uiState';
import { useNotices } from './notices';
import { useCollaboration } from '../collab/useCollaboration';
import { CollabOverlay } from '../collab/CollabOverlay';

type LoadState =
  | { kind: 'loading' }
  | { kind: 'error'; message: string }
  | { kind: 'ready'; editor: Editor; live: LiveSolve; loaded: LoadedSheet; source: SheetSource };

/** Open the sheet behind `routeId` (see resolveSheetSource), or `source` when given directly. */
export function SheetEditor({ routeId, source: given }: { routeId: string; source?: SheetSource }) {
  const [state, setState] = useState<LoadState>({ kind: 'loading' });
  // Loaded once per mount: when the editor itself moves the sheet (example → local) the route
  // changes but this editor stays (SheetPage keeps the key), so the route id must not reload it.
  const [openedAs] = useState(routeId);
  useEffect(() => {
    const source = given ?? resolveSheetSource(openedAs);
    if (!source) {
      setState({ kind: 'error', message: `There is no sheet "${openedAs}". Open your local sheet or one of the examples.` });
      return;
    }
    const abort = new AbortController();
    let live: LiveSolve | null = null;
    setState({ kind: 'loading' });
    source
      .load(abort.signal)
      .then(async (loaded) => ({ loaded, sheet: await prepareSheet(loaded.sheet, startSolverWorker) }))
      .then(
      ({ loaded, sheet }) => {
        if (abort.signal.aborted) return;
        const editor = createEditor(sheet);
        editor.loadDocument(editor.getDoc(), { readOnly: loaded.readOnly });
        editor.actions.setSymbolStyle(useEditorUi.getState().symbolStyle);
        // small sheets solve in the edit's own task (readings in the same frame), the rest in the worker
        live = startLiveSolve(editor, startSolverWorker, { inline: loadInlineSolver() });
        setState({ kind: 'ready', editor, live, loaded, source });
      },
      (e: unknown) => !abort.signal.aborted && setState({ kind: 'error', message: e instanceof Error ? e.message : String(e) }),
    );
    return () => {
      abort.abort();
      live?.dispose();
    };
  }, [openedAs, given]);

  if (state.kind === 'loading') return <div className="p-6 text-ink-muted" role="status">Opening sheet…</div>;
  if (state.kind === 'error')
    return (
      <div className="p-6" role="alert">
        <h1 className="text-lg font-semibold">The sheet could not be opened</h1>
        <p className="mt-2 max-w-2xl text-ink-muted">{state.message}</p>
      </div>
    );
  return <ReadyEditor editor={state.editor} live={state.live} loaded={state.loaded} source={state.source} />;
}

function ReadyEditor({ editor, live, loaded, source }: { editor: Editor; live: LiveSolve; loaded: LoadedSheet; source: SheetSource }) {
  const ctx = useMemo(() => ({ editor, live }), [editor, live]);
  return (
    <EditorContext.Provider value={ctx}>
      <ReactFlowProvider>
        <EditorScreen editor={editor} loaded={loaded} initialSource={source} />
      </ReactFlowProvider>
    </EditorContext.Provider>
  );
}

function EditorScreen({ editor, loaded, initialSource }: { editor: Editor; loaded: LoadedSheet; initialSource: SheetSource }) {
  const navigate = useNavigate();
  const sourceRef = useRef(initialSource);
  const version = useRef(loaded.version);
  const [notice, setNotice] = useState(loaded.notice);
  const getSource = useCallback(() => sourceRef.current, []);
  const onContinueAt = useCallback(
    (route: string) => {
      // the sheet now lives elsewhere (an example saved as the local sheet): keep editing here, same undo history
      const id = route.replace(/^\/sheets\//, '');
      const next = resolveSheetSource(id);
      if (next) sourceRef.current = next;
      setNotice('Saved as your local sheet; any earlier local sheet is kept as a backup.');
      navigate(route, { replace: true, state: { continuedFrom: initialSource.key } });
    },
    [navigate, initialSource.key],
  );
  const autosave = useAutosave(editor, getSource, version, onContinueAt);
  // Live co-editing when the sheet is a cloud project (src/collab); a no-op for other sources.
  const collab = useCollaboration(editor, initialSource.key);
  const ui = useEditorUi();
  const handlers = useMemo(
    () => ({
      onHelp: () => ui.setHelp(!ui.helpOpen),
      onSave: autosave.saveNow,
      onToggleReadings: () => ui.setPrefs({ showReadings: !ui.showReadings }),
      dialogOpen: ui.helpOpen,
    }),
    [ui, autosave.saveNow],
  );
  useEditorShortcuts(editor, handlers);
  const notices = useNotices((s) => s.notices);

  return (
    <div className="flex h-full min-h-0 flex-col" data-testid="sheet-editor">
      <Toolbar title={loaded.title} notice={notice} status={autosave.status} />
      <div
        className={`grid min-h-0 flex-1 ${
          ui.inspector ? 'grid-cols-[12.5rem_minmax(0,1fr)_23rem] max-xl:grid-cols-[9.5rem_minmax(0,1fr)_19.5rem]' : 'grid-cols-[12.5rem_minmax(0,1fr)] max-xl:grid-cols-[9.5rem_minmax(0,1fr)]'
        }`}
      >
        <div className="min-h-0 border-r border-rule bg-panel">
          <Palette />
        </div>
        <div className="relative flex min-h-0 flex-col bg-paper">
          <div className="relative min-h-0 flex-1">
            <SchematicCanvas showReadings={ui.showReadings} />
            <CanvasBanner />
            {!ui.inspector && (
              <button
                type="button"
                onClick={() => ui.setPrefs({ inspector: true })}
                // at the edge the inspector went to, clear of the co-editing avatars (top right)
                className="absolute right-0 top-1/2 z-20 -translate-y-1/2 rounded-l border border-r-0 border-rule bg-panel px-2 py-1 text-[12px] text-ink-muted shadow-sm hover:text-ink"
                data-testid="show-inspector"
                title="Show the inspector: the selected part, the sheet, checks and readings"
              >
                « Inspector
              </button>
            )}
            <CollabOverlay editor={editor} collab={collab} />
            <div className="pointer-events-none absolute inset-x-0 top-2 z-20 flex flex-col items-center gap-1" aria-live="polite">
              {notices.map((n) => (
                <div key={n.id} className={`pointer-events-auto rounded border px-3 py-1 text-[12px] shadow-sm ${n.tone === 'error' ? 'border-danger/60 bg-panel text-danger' : 'border-rule bg-panel text-ink'}`}>
                  {n.text}
                </div>
              ))}
            </div>
          </div>
          <StatusBar />
        </div>
        {ui.inspector && <RightPanel />}
      </div>
      {ui.helpOpen && <ShortcutHelp onClose={() => ui.setHelp(false)} />}
    </div>
  );
}
