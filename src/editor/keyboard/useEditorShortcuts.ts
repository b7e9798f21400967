// Window-level keyboard handling for the editor, plus the system clipboard (copy/cut/paste
// events carry a JSON fragment, so parts can be pasted into another tab's sheet).
import { useEffect } from 'react';
import { useReactFlow } from '@xyflow/react';
import type { Editor } from '../store/actions';
import { commandFor, PLACE_KEYS } from './shortcuts';
import { GRID } from '../symbols/geometry';
import type { Fragment } from '../store/commands';
import { notify } from '../notices';
import { useFitSchematic } from '../canvas/fitSchematic';
import type { PartType } from '../../../shared/parts/specs';
import { parseSheet } from '../../../shared/sheet';

const FRAGMENT_FORMAT = 'tapline.fragment';

function isTyping(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  if (el.isContentEditable) return true;
  if (el.tagName === 'TEXTAREA' || el.tagName === 'SELECT') return true;
  if (el.tagName === 'INPUT') return !['range', 'checkbox', 'radio', 'button'].includes((el as HTMLInputElement).type);
  return false;
}

function onCanvas(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  return !el || el === document.body || !!el.closest?.('.tl-canvas');
}

export interface ShortcutHandlers {
  onHelp(): void;
  onSave(): void;
  onToggleReadings(): void;
  /** true while a dialog has the keyboard */
  dialogOpen: boolean;
}

const PLACE_BY_KEY = new Map(Object.entries(PLACE_KEYS).map(([t, k]) => [k, t as PartType]));

export function useEditorShortcuts(editor: Editor, h: ShortcutHandlers): void {
  const rf = useReactFlow();
  const fit = useFitSchematic();
  useEffect(() => {
    const nudge = (dx: number, dy: number) => {
      const ids = editor.getSession().selection.parts;
      if (!ids.length) return;
      const centers: Record<string, { x: number; y: number }> = {};
      for (const p of editor.getDoc().parts)
        if (ids.includes(p.id)) centers[p.id] = { x: (p.position?.x ?? 0) + dx, y: (p.position?.y ?? 0) + dy };
      editor.actions.beginDrag(ids.length);
      editor.actions.moveParts(centers);
      editor.actions.endDrag();
    };
    const nextPart = (back: boolean) => {
      const parts = editor.getDoc().parts;
      if (!parts.length) return;
      const cur = editor.getSession().selection.parts[0];
      const i = parts.findIndex((p) => p.id === cur);
      const n = i < 0 ? (back ? parts.length - 1 : 0) : (i + (back ? parts.length - 1 : 1)) % parts.length;
      editor.actions.select({ parts: [parts[n].id] });
    };

    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented || isTyping(e.target)) return;
      if (h.dialogOpen && e.key !== '?') return;
      const command = commandFor(e);
      const step = e.shiftKey ? 5 * GRID : GRID;
      if (!command) {
        const type = !e.ctrlKey && !e.metaKey && !e.altKey ? PLACE_BY_KEY.get(e.key) : undefined;
        if (type && !editor.getSession().readOnly) {
          editor.actions.setTool({ kind: 'place', partType: type });
          e.preventDefault();
        }
        return;
      }
      // copy / cut / paste go through the clipboard events below
      if (command === 'copy' || command === 'cut' || command === 'paste') return;
      // Tab keeps moving focus through the page unless the canvas (or nothing) has it
      if (command === 'nextPart' && !onCanvas(e.target)) return;
      e.preventDefault();
      const a = editor.actions;
      switch (command) {
        case 'undo': return void a.undo();
        case 'redo': return void a.redo();
        case 'duplicate': return void a.duplicateSelection();
        case 'selectAll': return a.selectAll();
        case 'delete': return a.deleteSelection();
        case 'rotateCw': return a.rotateSelection(1);
        case 'rotateCcw': return a.rotateSelection(-1);
        case 'fit': return fit();
        case 'zoomIn': return void rf.zoomIn();
        case 'zoomOut': return void rf.zoomOut();
        case 'escape':
          if (editor.getSession().tool.kind !== 'select') a.setTool({ kind: 'select' });
          else a.clearSelection();
          return;
        case 'help': return h.onHelp();
        case 'save': return h.onSave();
        case 'toggleReadings': return h.onToggleReadings();
        case 'nudgeLeft': return nudge(-step, 0);
        case 'nudgeRight': return nudge(step, 0);
        case 'nudgeUp': return nudge(0, -step);
        case 'nudgeDown': return nudge(0, step);
        case 'nextPart': return nextPart(e.shiftKey);
      }
    };

    const onCopy = (e: ClipboardEvent, cut: boolean) => {
      if (isTyping(e.target) || h.dialogOpen) return;
      const fragment = editor.actions.copySelection();
      if (!fragment) return;
      e.clipboardData?.setData('text/plain', JSON.stringify({ format: FRAGMENT_FORMAT, ...fragment }));
      e.preventDefault();
      if (cut) editor.actions.deleteSelection();
    };
    const onPaste = (e: ClipboardEvent) => {
      if (isTyping(e.target) || h.dialogOpen) return;
      const text = e.clipboardData?.getData('text/plain') ?? '';
      let fragment: Fragment | undefined;
      try {
        const data = JSON.parse(text) as { format?: string } & Fragment;
        if (data.format === FRAGMENT_FORMAT) {
          // another tab's clipboard is outside input: validate it as a sheet before pasting
          const r = parseSheet({ format: 'tapline.sheet', version: 1, parts: data.parts, wires: data.wires ?? [] });
          if (r.ok) fragment = { parts: r.sheet.parts, wires: r.sheet.wires };
          else notify(`Could not paste: ${r.error.message}`, 'error');
        }
      } catch {
        // not ours: fall back to the in-tab clipboard
      }
      e.preventDefault();
      const ids = editor.actions.paste(fragment);
      if (!ids.length && text && !fragment) notify('The clipboard holds no Tapline parts to paste.');
    };
    const copy = (e: ClipboardEvent) => onCopy(e, false);
    const cut = (e: ClipboardEvent) => onCopy(e, true);
    window.addEventListener('keydown', onKey);
    document.addEventListener('copy', copy);
    document.addEventListener('cut', cut);
    document.addEventListener('paste', onPaste);
    return () => {
      window.removeEventListener('keydown', onKey);
      document.removeEventListener('copy', copy);
      document.removeEventListener('cut', cut);
      document.removeEventListener('paste', onPaste);
    };
  }, [editor, rf, h, fit]);
}
