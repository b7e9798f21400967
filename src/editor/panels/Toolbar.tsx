// The editor toolbar: sheet title and save state, edit and view commands, the examples menu, and
// a slot for tools registered by other modules (extensions.ts).
import { memo } from 'react';
import { Link } from 'react-router-dom';
import { useReactFlow } from '@xyflow/react';
import { useEditor, useEditorState } from '../EditorContext';
import { useExtensionRegistry } from '../extensions';
import { useEditorUi } from '../uiState';
import { listExamples } from '../sources/exampleSources';
import type { SaveStatus } from '../useAutosave';
import { useFitSchematic } from '../canvas/fitSchematic';

function SaveBadge({ status }: { status: SaveStatus }) {
  const text =
    status.kind === 'clean'
      ? status.at
        ? `Saved ${status.at.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}`
        : 'No changes'
      : status.kind === 'dirty'
        ? 'Unsaved changes'
        : status.kind === 'saving'
          ? 'Saving…'
          : status.kind === 'unsaved-source'
            ? 'Not saved (read-only source)'
            : 'Save failed';
  return (
    <span
      className={`text-[11px] ${status.kind === 'error' ? 'text-danger' : 'text-ink-muted'}`}
      title={status.kind === 'error' ? status.message : undefined}
      data-testid="save-status"
      role="status"
    >
      {text}
    </span>
  );
}

function Btn({ label, onClick, disabled, children, pressed, testId }: { label: string; onClick: () => void; disabled?: boolean; children: React.ReactNode; pressed?: boolean; testId?: string }) {
  return (
    <button
      type="button"
      onClick={onClick}
      disabled={disabled}
      aria-label={label}
      aria-pressed={pressed}
      title={label}
      data-testid={testId}
      className={`flex h-7 min-w-7 items-center justify-center rounded px-1.5 text-[13px] disabled:opacity-35 ${pressed ? 'bg-sunken text-ink' : 'text-ink-muted hover:bg-sunken hover:text-ink'}`}
    >
      {children}
    </button>
  );
}

const Sep = () => <span className="mx-1 h-5 w-px bg-rule" aria-hidden="true" />;

export const Toolbar = memo(function Toolbar({ title, notice, status }: { title: string; notice?: string; status: SaveStatus }) {
  const editor = useEditor();
  const rf = useReactFlow();
  const fit = useFitSchematic();
  const history = useEditorState((s) => s.history);
  const selection = useEditorState((s) => s.session.selection);
  const readOnly = useEditorState((s) => s.session.readOnly);
  const docTitle = useEditorState((s) => s.doc.title);
  const style = useEditorState((s) => s.session.symbolStyle);
  const tools = useExtensionRegistry((s) => s.tools);
  const ui = useEditorUi();
  const hasSel = selection.parts.length + selection.wires.length > 0;
  const examples = listExamples();
  return (
    <div className="flex h-11 shrink-0 items-center gap-1 border-b border-rule bg-panel px-3" role="toolbar" aria-label="Editor">
      <div className="mr-2 flex min-w-0 flex-1 flex-col justify-center">
        <h1 className="truncate text-[14px] font-semibold leading-tight" data-testid="sheet-title">
          {docTitle || title}
          {readOnly && <span className="ml-2 rounded bg-sunken px-1.5 text-[10px] font-medium uppercase text-ink-muted">read-only</span>}
        </h1>
        <div className="flex min-w-0 items-center gap-2 whitespace-nowrap leading-tight">
          <SaveBadge status={status} />
          {notice && <span className="truncate text-[11px] text-caution" title={notice}>{notice}</span>}
        </div>
      </div>
      <div className="ml-auto flex shrink-0 items-center gap-0.5 whitespace-nowrap">
        <Btn label={history.undoLabel ? `Undo: ${history.undoLabel}` : 'Undo'} onClick={() => editor.actions.undo()} disabled={!history.canUndo || readOnly} testId="undo">↶</Btn>
        <Btn label={history.redoLabel ? `Redo: ${history.redoLabel}` : 'Redo'} onClick={() => editor.actions.redo()} disabled={!history.canRedo || readOnly} testId="redo">↷</Btn>
        <Sep />
        <Btn label="Rotate selection (R)" onClick={() => editor.actions.rotateSelection()} disabled={!selection.parts.length || readOnly} testId="rotate">⟳</Btn>
        <Btn label="Delete selection (Delete)" onClick={() => editor.actions.deleteSelection()} disabled={!hasSel || readOnly} testId="delete">✕</Btn>
        <Sep />
        <Btn label="Zoom out (−)" onClick={() => void rf.zoomOut()}>−</Btn>
        <Btn label="Zoom to fit (F)" onClick={fit} testId="zoom-fit">⤢</Btn>
        <Btn label="Zoom in (+)" onClick={() => void rf.zoomIn()}>+</Btn>
        <Sep />
        <Btn label="Show readings on parts (V)" pressed={ui.showReadings} onClick={() => ui.setPrefs({ showReadings: !ui.showReadings })} testId="toggle-readings">
          <span className="text-[11px] font-medium">Readings</span>
        </Btn>
        <Btn
          label={`Symbols: ${style === 'iec' ? 'IEC 60617' : 'IEEE 315'} (click to switch)`}
          onClick={() => {
            const next = style === 'iec' ? 'ieee' : 'iec';
            editor.actions.setSymbolStyle(next);
            ui.setPrefs({ symbolStyle: next });
          }}
          testId="symbol-style"
        >
          <span className="text-[11px] font-medium">{style === 'iec' ? 'IEC' : 'IEEE'}</span>
        </Btn>
        {tools.length > 0 && <Sep />}
        {tools.map((t) => (
          <span key={t.id} className="contents">{t.render()}</span>
        ))}
        <Sep />
        <details className="relative">
          <summary className="flex h-7 cursor-pointer list-none items-center whitespace-nowrap rounded px-2 text-[12px] text-ink-muted hover:bg-sunken hover:text-ink" data-testid="examples-menu">
            Examples ▾
          </summary>
          <ul
            className="absolute right-0 z-40 mt-1 w-72 rounded border border-rule bg-panel py-1 shadow-lg"
            onClick={(e) => e.currentTarget.closest('details')?.removeAttribute('open')}
          >
            {examples.map((e) => (
              <li key={e.name}>
                <Link to={`/sheets/${e.routeId}`} className="block px-3 py-1.5 text-[13px] hover:bg-sunken" title={e.description} data-testid={`example-${e.name}`}>
                  {e.title}
                </Link>
              </li>
            ))}
            {!examples.length && <li className="px-3 py-1.5 text-[12px] text-ink-muted">No examples bundled.</li>}
          </ul>
        </details>
        <Btn label="Keyboard shortcuts (?)" onClick={() => ui.setHelp(true)} testId="help">?</Btn>
      </div>
    </div>
  );
});
