// One line under the canvas: solve state, findings, what is selected, what the tool does.
import { memo } from 'react';
import { useShallow } from 'zustand/react/shallow';
import { useEditorState, useSolveState } from '../EditorContext';
import { useEditorUi } from '../uiState';
import { paletteLabel } from './Palette';

export const StatusBar = memo(function StatusBar() {
  // only what the line shows (ms rounded), so a new operating point rarely re-renders it
  const live = useSolveState(
    useShallow((s) => ({
      status: s.status,
      busy: s.busy,
      ms: s.ms === null ? null : s.ms < 1 ? '<1' : String(Math.round(s.ms)),
      n: s.warnings.length,
      nets: s.result ? Object.keys(s.result.nets).length : 0,
    })),
  );
  const tool = useEditorState((s) => s.session.tool);
  const sel = useEditorState((s) => s.session.selection);
  const parts = useEditorState((s) => s.doc.parts.length);
  const openTab = useEditorUi((s) => s.openTab);
  const solve =
    live.status === 'idle' ? (parts ? 'Solving…' : 'Nothing to solve yet') : live.status === 'error' ? 'Cannot solve' : `Solved · ${live.nets} nets${live.ms !== null ? ` · ${live.ms} ms` : ''}`;
  return (
    <div className="flex h-7 shrink-0 items-center gap-3 border-t border-rule bg-panel px-3 text-[11px] text-ink-muted" data-testid="status-bar">
      <span className={live.status === 'error' ? 'font-medium text-danger' : ''} data-testid="solve-status" aria-live="polite">
        {live.busy && live.status !== 'idle' ? 'Solving… ' : ''}
        {solve}
      </span>
      {(live.n > 0 || live.status === 'error') && (
        <button type="button" className="hover:text-ink hover:underline" onClick={() => openTab('checks')}>
          {live.status === 'error' ? 'See why' : `${live.n} finding${live.n > 1 ? 's' : ''}`}
        </button>
      )}
      <span className="ml-auto">
        {tool.kind === 'place'
          ? `Placing ${paletteLabel(tool.partType)} — click the canvas (Shift keeps placing, Esc stops)`
          : sel.parts.length || sel.wires.length
            ? `${sel.parts.length} part${sel.parts.length === 1 ? '' : 's'}, ${sel.wires.length} wire${sel.wires.length === 1 ? '' : 's'} selected`
            : `${parts} part${parts === 1 ? '' : 's'}`}
      </span>
    </div>
  );
});
