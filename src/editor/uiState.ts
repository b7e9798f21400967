// View state of the editor screen that is neither document nor session data: which panel tab is
// open, overlays, display toggles. Display preferences persist per browser.
import { create } from 'zustand';

const PREFS_KEY = 'tapline.editor.prefs';

interface Prefs {
  showReadings: boolean;
  symbolStyle: 'iec' | 'ieee';
  /** the inspector column is shown (hide it to give a narrow screen's width to the canvas) */
  inspector: boolean;
}

function loadPrefs(): Prefs {
  try {
    const p = JSON.parse(localStorage.getItem(PREFS_KEY) ?? '{}') as Partial<Prefs>;
    return { showReadings: p.showReadings !== false, symbolStyle: p.symbolStyle === 'ieee' ? 'ieee' : 'iec', inspector: p.inspector !== false };
  } catch {
    return { showReadings: true, symbolStyle: 'iec', inspector: true };
  }
}

export interface EditorUi extends Prefs {
  activeTab: string;
  helpOpen: boolean;
  openTab(id: string): void;
  setHelp(open: boolean): void;
  setPrefs(p: Partial<Prefs>): void;
}

export const useEditorUi = create<EditorUi>((set, get) => ({
  ...loadPrefs(),
  activeTab: 'part',
  helpOpen: false,
  // opening a tab (a finding's "See why", a tool's button) brings the inspector back
  openTab: (id) => {
    set({ activeTab: id });
    if (!get().inspector) get().setPrefs({ inspector: true });
  },
  setHelp: (open) => set({ helpOpen: open }),
  setPrefs: (p) => {
    set(p);
    const { showReadings, symbolStyle, inspector } = get();
    try {
      localStorage.setItem(PREFS_KEY, JSON.stringify({ showReadings, symbolStyle, inspector }));
    } catch {
      // preferences are a convenience; a full storage is not worth an error
    }
  },
}));

/** Open a right-panel tab from anywhere (e.g. a tool's own button). */
export function openPanelTab(id: string): void {
  useEditorUi.getState().openTab(id);
}
