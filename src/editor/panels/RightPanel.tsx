// The right-hand panel: built-in tabs plus any registered by tools (extensions.ts).
import { memo, useMemo, type ReactNode } from 'react';
import { useExtensionRegistry, type PanelTab } from '../extensions';
import { useEditorUi } from '../uiState';
import { useSolveState } from '../EditorContext';
import { PropertyPanel } from './PropertyPanel';
import { SheetPanel } from './SheetPanel';
import { ChecksPanel } from './ChecksPanel';
import { ReadingsTable } from './ReadingsTable';
import { severityRank } from '../solve/solveView';

function ChecksBadge(): ReactNode {
  const warnings = useSolveState((s) => s.warnings);
  const failed = useSolveState((s) => s.status === 'error');
  if (failed) return <span className="rounded-full bg-danger px-1.5 text-[10px] font-bold text-paper">!</span>;
  if (!warnings.length) return null;
  const worst = Math.min(...warnings.map((w) => severityRank(w.severity)));
  return (
    <span className={`num rounded-full px-1.5 text-[10px] font-bold text-paper ${worst <= 1 ? 'bg-danger' : 'bg-caution'}`} data-testid="checks-count">
      {warnings.length}
    </span>
  );
}

const BUILT_IN: PanelTab[] = [
  { id: 'part', label: 'Part', order: 10, render: () => <PropertyPanel /> },
  { id: 'sheet', label: 'Sheet', order: 20, render: () => <SheetPanel /> },
  { id: 'checks', label: 'Checks', order: 30, render: () => <ChecksPanel />, badge: () => <ChecksBadge /> },
  { id: 'readings', label: 'Readings', order: 40, render: () => <ReadingsTable /> },
];

export const RightPanel = memo(function RightPanel() {
  const extra = useExtensionRegistry((s) => s.tabs);
  const tabs = useMemo(() => [...BUILT_IN, ...extra].sort((a, b) => a.order - b.order), [extra]);
  const active = useEditorUi((s) => s.activeTab);
  const openTab = useEditorUi((s) => s.openTab);
  const setPrefs = useEditorUi((s) => s.setPrefs);
  const current = tabs.find((t) => t.id === active) ?? tabs[0];
  return (
    <aside className="flex h-full min-h-0 flex-col border-l border-rule bg-panel" aria-label="Inspector">
      <div className="flex shrink-0 items-start border-b border-rule">
        {/* pills that wrap: every tab stays visible however many tools register one */}
        <div role="tablist" aria-label="Inspector tabs" className="flex min-w-0 flex-1 flex-wrap gap-1 px-2 py-1.5">
          {tabs.map((t) => {
            const on = t.id === current.id;
            return (
              <button
                key={t.id}
                type="button"
                role="tab"
                aria-selected={on}
                aria-controls={`panel-${t.id}`}
                id={`tab-${t.id}`}
                data-testid={`panel-tab-${t.id}`}
                onClick={() => openTab(t.id)}
                className={`flex items-center gap-1.5 whitespace-nowrap rounded px-2 py-0.5 text-[12px] ${
                  on ? 'bg-sunken font-medium text-ink shadow-[inset_0_-2px_0_var(--tl-accent)]' : 'text-ink-muted hover:bg-sunken/60 hover:text-ink'
                }`}
              >
                {t.label}
                {t.badge?.()}
              </button>
            );
          })}
        </div>
        <button
          type="button"
          onClick={() => setPrefs({ inspector: false })}
          className="m-1.5 shrink-0 rounded px-1.5 py-0.5 text-[12px] text-ink-muted hover:bg-sunken hover:text-ink"
          aria-label="Hide the inspector (more room for the canvas)"
          title="Hide the inspector (more room for the canvas)"
          data-testid="hide-inspector"
        >
          »
        </button>
      </div>
      <div role="tabpanel" id={`panel-${current.id}`} aria-labelledby={`tab-${current.id}`} className="min-h-0 flex-1 overflow-y-auto">
        {current.render()}
      </div>
    </aside>
  );
});
