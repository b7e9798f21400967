// Short-lived messages under the toolbar ("Pins R1.a and R2.b are already wired").
import { create } from 'zustand';

export interface Notice {
  id: number;
  text: string;
  tone: 'info' | 'error';
}

interface NoticeState {
  notices: Notice[];
  push(text: string, tone?: Notice['tone']): void;
  dismiss(id: number): void;
}

let next = 1;

export const useNotices = create<NoticeState>((set) => ({
  notices: [],
  push(text, tone = 'info') {
    const id = next++;
    set((s) => ({ notices: [...s.notices.slice(-2), { id, text, tone }] }));
    setTimeout(() => set((s) => ({ notices: s.notices.filter((n) => n.id !== id) })), tone === 'error' ? 6000 : 3500);
  },
  dismiss(id) {
    set((s) => ({ notices: s.notices.filter((n) => n.id !== id) }));
  },
}));

/** Show a message (callable outside React). */
export function notify(text: string, tone: Notice['tone'] = 'info'): void {
  useNotices.getState().push(text, tone);
}
