// The "Analyse" inspector tab: sweep, tolerance and budget behind one segmented switch, so the
// narrow inspector keeps its tab strip short.
import { create } from 'zustand';
import { openPanelTab } from '../uiState';
import { SweepPanel } from './sweep/SweepPanel';
import { TolerancePanel } from './tolerance/TolerancePanel';
import { BudgetPanel } from './budget/BudgetPanel';

export type ToolView = 'sweep' | 'tolerance' | 'budget';

export const ANALYSE_TAB_ID = 'analyse';

export const useToolView = create<{ view: ToolView }>(() => ({ view: 'sweep' }));

/** Open the Analyse tab at one of its views (from a button anywhere in the editor). */
export function openToolView(view: ToolView): void {
  useToolView.setState({ view });
  openPanelTab(ANALYSE_TAB_ID);
}

const VIEWS: Array<{ id: ToolView; label: string }> = [
  { id: 'sweep', label: 'Sweep' },
  { id: 'tolerance', label: 'Tolerance' },
  { id: 'budget', label: 'Budget' },
];

export function AnalysisTab() {
  const view = useToolView((s) => s.view);
  return (
    <div>
      <div className="sticky top-0 z-10 flex gap-0.5 border-b border-rule bg-panel px-3 py-1.5" role="tablist" aria-label="Analyses">
        {VIEWS.map((v) => (
          <button
            key={v.id}
            type="button"
            role="tab"
            aria-selected={view === v.id}
            data-testid={`tool-view-${v.id}`}
            onClick={() => useToolView.setState({ view: v.id })}
            className={`flex-1 rounded px-2 py-1 text-[12px] ${view === v.id ? 'bg-sunken font-medium text-ink' : 'text-ink-muted hover:text-ink'}`}
          >
            {v.label}
          </button>
        ))}
      </div>
      {view === 'sweep' ? <SweepPanel /> : view === 'tolerance' ? <TolerancePanel /> : <BudgetPanel />}
    </div>
  );
}
