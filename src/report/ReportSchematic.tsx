// The schematic in the report: the editor's own canvas, read-only, fitted to its box, with the
// live operating point (the same worker solve the editor uses) for the report's tables.
import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { ReactFlowProvider } from '@xyflow/react';
import '@xyflow/react/dist/base.css';
import '../editor/editor.css';
import type { Sheet } from '../../shared/sheet';
import { EditorContext } from '../editor/EditorContext';
import { createEditor } from '../editor/store/actions';
import { startLiveSolve } from '../editor/solve/liveSolve';
import { startSolverWorker } from '../editor/solve/workerHandle';
import { layoutMissingPositions } from '../editor/sources/autoLayout';
import { SchematicCanvas } from '../editor/canvas/SchematicCanvas';
import { useEditorUi } from '../editor/uiState';

/** Provides a read-only editor + live solve for `sheet` to its children. */
export function ReportEditor({ sheet, children }: { sheet: Sheet; children: ReactNode }) {
  const [ctx, setCtx] = useState<{ editor: ReturnType<typeof createEditor>; live: ReturnType<typeof startLiveSolve> } | null>(null);
  useEffect(() => {
    const editor = createEditor(layoutMissingPositions(sheet));
    editor.loadDocument(editor.getDoc(), { readOnly: true });
    editor.actions.setSymbolStyle(useEditorUi.getState().symbolStyle);
    const live = startLiveSolve(editor, startSolverWorker);
    setCtx({ editor, live });
    return () => live.dispose();
  }, [sheet]);
  const value = useMemo(() => ctx, [ctx]);
  if (!value) return null;
  return (
    <EditorContext.Provider value={value}>
      <ReactFlowProvider>{children}</ReactFlowProvider>
    </EditorContext.Provider>
  );
}

export function ReportSchematic() {
  return (
    <div className="tl-report-canvas" data-testid="report-schematic">
      <SchematicCanvas showReadings />
    </div>
  );
}
