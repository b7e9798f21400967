// Over the canvas: why the sheet cannot be solved, or how to start on an empty one.
import { useEditorState, useSolveState } from '../EditorContext';
import { useEditorUi } from '../uiState';

export function CanvasBanner() {
  const failure = useSolveState((s) => s.failure);
  const empty = useEditorState((s) => s.doc.parts.length === 0);
  const openTab = useEditorUi((s) => s.openTab);
  if (empty)
    return (
      <div className="pointer-events-none absolute inset-0 flex items-center justify-center">
        <div className="max-w-sm rounded border border-dashed border-rule bg-panel/80 px-5 py-4 text-center text-[13px] leading-relaxed text-ink-muted">
          <p className="font-medium text-ink">An empty sheet</p>
          <p className="mt-1">Pick a part in the palette (or press 1–9) and click here to place it. Drag from pin to pin to wire. Add a ground: voltages are measured from it.</p>
        </div>
      </div>
    );
  if (!failure) return null;
  return (
    <div className="absolute inset-x-0 bottom-3 z-20 flex justify-center px-4">
      <div role="alert" className="flex max-w-2xl items-start gap-3 rounded border border-danger/60 bg-panel px-3 py-2 text-[12px] shadow-md" data-testid="canvas-solve-error">
        <span className="mt-px text-[10px] font-bold uppercase tracking-wider text-danger">Cannot solve</span>
        <span className="leading-snug">{failure.error.message}</span>
        <button type="button" className="shrink-0 text-accent hover:underline" onClick={() => openTab('checks')}>
          Details
        </button>
      </div>
    </div>
  );
}
