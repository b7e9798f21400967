// The divider designer and the value finder, in one dialog. Chosen parts go into the sheet as
// one undo step.
import { useEffect, useRef, useState } from 'react';
import { create } from 'zustand';
import { DividerTab } from './DividerTab';
import { ValueFinderTab } from './ValueFinderTab';

interface DesignerUi {
  open: boolean;
  tab: 'divider' | 'value';
  show(tab?: 'divider' | 'value'): void;
  close(): void;
}

export const useDesignerUi = create<DesignerUi>((set) => ({
  open: false,
  tab: 'divider',
  show: (tab) => set((s) => ({ open: true, tab: tab ?? s.tab })),
  close: () => set({ open: false }),
}));

export function DesignerDialog() {
  const { open, tab, close } = useDesignerUi();
  const ref = useRef<HTMLDialogElement>(null);
  const [, force] = useState(0);
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
    force((x) => x + 1);
  }, [open]);
  return (
    <dialog
      ref={ref}
      onClose={close}
      // keys typed in the dialog are the dialog's: the editor's canvas shortcuts (Delete, R, Escape) must not see them
      onKeyDown={(e) => {
        e.stopPropagation();
        if (e.key === 'Escape') {
          e.preventDefault();
          close();
        }
      }}
      className="m-auto max-h-[90vh] w-[min(860px,94vw)] overflow-hidden rounded-lg border border-rule bg-panel p-0 text-ink shadow-xl backdrop:bg-[rgb(0_0_0/0.45)]"
      aria-label="Design helpers"
      data-testid="designer-dialog"
    >
      {open && (
        <div className="flex max-h-[90vh] flex-col">
          <header className="flex items-center gap-1 border-b border-rule px-3 py-2">
            <h2 className="mr-3 text-sm font-semibold">Design helpers</h2>
            {(['divider', 'value'] as const).map((t) => (
              <button
                key={t}
                type="button"
                role="tab"
                aria-selected={tab === t}
                className={`rounded px-2 py-1 text-sm ${tab === t ? 'bg-sunken font-medium text-ink' : 'text-ink-muted hover:text-ink'}`}
                onClick={() => useDesignerUi.setState({ tab: t })}
                data-testid={`designer-tab-${t}`}
              >
                {t === 'divider' ? 'Divider designer' : 'Value finder'}
              </button>
            ))}
            <button type="button" className="ml-auto rounded px-2 py-1 text-sm text-ink-muted hover:bg-sunken" onClick={close} aria-label="Close">
              ✕
            </button>
          </header>
          <div className="min-h-0 flex-1 overflow-auto">{tab === 'divider' ? <DividerTab /> : <ValueFinderTab />}</div>
        </div>
      )}
    </dialog>
  );
}
