// Saves the sheet through its source after a pause in local editing (remote edits are the
// server's to keep), on Ctrl+S, and when the page is hidden.
import { useCallback, useEffect, useRef, useState } from 'react';
import type { Editor } from './store/actions';
import type { SheetSource } from './sheetSource';

export type SaveStatus =
  | { kind: 'clean'; at?: Date }
  | { kind: 'dirty' }
  | { kind: 'saving' }
  | { kind: 'error'; message: string }
  | { kind: 'unsaved-source' };

export interface Autosave {
  status: SaveStatus;
  saveNow(): void;
}

export function useAutosave(
  editor: Editor,
  source: () => SheetSource,
  baseVersion: { current: number | string | undefined },
  onContinueAt: (route: string) => void,
): Autosave {
  const [status, setStatus] = useState<SaveStatus>(() => (source().save ? { kind: 'clean' } : { kind: 'unsaved-source' }));
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const dirty = useRef(false);
  const saving = useRef<Promise<void> | null>(null);

  const flush = useCallback(
    async (reason: 'autosave' | 'explicit') => {
      if (timer.current) clearTimeout(timer.current);
      timer.current = null;
      const src = source();
      if (!src.save || !dirty.current) return;
      if (saving.current) await saving.current;
      dirty.current = false;
      setStatus({ kind: 'saving' });
      const doc = editor.getDoc();
      const run = src
        .save(doc, { title: doc.title ?? 'Untitled sheet', baseVersion: baseVersion.current, reason })
        .then((r) => {
          if (r.version !== undefined) baseVersion.current = r.version;
          setStatus(dirty.current ? { kind: 'dirty' } : { kind: 'clean', at: new Date() });
          if (r.continueAt) onContinueAt(r.continueAt);
        })
        .catch((e: unknown) => {
          dirty.current = true;
          setStatus({ kind: 'error', message: e instanceof Error ? e.message : String(e) });
        })
        .finally(() => {
          saving.current = null;
        });
      saving.current = run;
      await run;
    },
    [editor, source, baseVersion, onContinueAt],
  );

  useEffect(() => {
    const off = editor.subscribePatches((b) => {
      if (b.origin === 'remote') return;
      const src = source();
      if (!src.save) return;
      dirty.current = true;
      // the same state object when already dirty, so a slider pull does not re-render the screen
      setStatus((prev) => (prev.kind === 'dirty' ? prev : { kind: 'dirty' }));
      const delay = src.autosaveDelayMs ?? 600;
      if (delay <= 0) return;
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => void flush('autosave'), delay);
    });
    const onHide = () => void flush('autosave');
    window.addEventListener('pagehide', onHide);
    return () => {
      off();
      window.removeEventListener('pagehide', onHide);
      void flush('autosave');
    };
  }, [editor, source, flush]);

  return { status, saveNow: useCallback(() => void flush('explicit'), [flush]) };
}
