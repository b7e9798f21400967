// Registers the design tools with the editor (src/editor/extensions.ts): one inspector tab (sweep, tolerance, budget) and
// two toolbar tools. Imported once by src/routes.tsx.
import { useEffect } from 'react';
import { useParams } from 'react-router-dom';
import { registerPanelTab, registerToolbarTool } from '../extensions';
import { openToolSession, useToolSession } from './results/toolSession';
import { AnalysisTab, ANALYSE_TAB_ID } from './AnalysisTab';
import { DesignerDialog, useDesignerUi } from './designer/DesignerDialog';
import { ExportMenu } from './export/ExportMenu';
import './tools.css';

/** Binds the tools' session to the open sheet's route id before a panel reads it. */
function WithSession({ children }: { children: React.ReactNode }) {
  const { id = 'local' } = useParams();
  const current = useToolSession((s) => s.sheetKey);
  useEffect(() => openToolSession(id), [id]);
  return current === id ? <>{children}</> : null;
}

function DesignButton() {
  return (
    <>
      <button
        type="button"
        className="flex h-7 items-center rounded px-2 text-[12px] font-medium text-ink-muted hover:bg-sunken hover:text-ink"
        onClick={() => useDesignerUi.getState().show()}
        title="Divider designer and value finder"
        data-testid="open-designer"
      >
        Design…
      </button>
      <DesignerDialog />
    </>
  );
}

let registered = false;

/** Idempotent. */
export function registerDesignTools(): void {
  if (registered) return;
  registered = true;
  registerPanelTab({ id: ANALYSE_TAB_ID, label: 'Analyse', order: 50, render: () => <WithSession><AnalysisTab /></WithSession> });
  registerToolbarTool({ id: 'designer', order: 10, render: () => <DesignButton /> });
  registerToolbarTool({ id: 'export', order: 20, render: () => <WithSession><ExportMenu /></WithSession> });
}

registerDesignTools();
