// Readings change on every slider step while the structure of the canvas does not. This writes a
// reading straight into its element when the live solve changes it, so React does not render and
// reconcile the node for each new number: the element is React's (created, placed, removed by
// it), its text and the listed attributes are this hook's.
import { useLayoutEffect, useRef, type RefObject } from 'react';
import { useEditorContext } from '../EditorContext';
import type { LiveSolveState } from '../solve/liveSolve';

const UNSET = Symbol('unset');

interface Writer<T, E extends HTMLElement> {
  select: (s: LiveSolveState) => T;
  write: (el: E, value: T) => void;
  last: T | typeof UNSET;
}

function apply<T, E extends HTMLElement>(w: Writer<T, E>, el: E | null, s: LiveSolveState): void {
  if (!el) return;
  const value = w.select(s);
  if (w.last !== UNSET && Object.is(value, w.last)) return;
  w.last = value;
  w.write(el, value);
}

/**
 * A ref for an element whose content `write` keeps in step with `select(liveSolveState)`; `write`
 * runs on mount, when the selected value changes (compared with Object.is, so select shared
 * objects or primitives) and after every render of the component. Render the element without
 * children: React must not own the text this writes.
 */
export function useLiveDom<T, E extends HTMLElement = HTMLElement>(select: (s: LiveSolveState) => T, write: (el: E, value: T) => void): RefObject<E | null> {
  const store = useEditorContext().live.store;
  const ref = useRef<E | null>(null);
  const writer = useRef<Writer<T, E>>({ select, write, last: UNSET });
  useLayoutEffect(() => {
    // after every render: the functions may close over new props (another part, readings hidden)
    writer.current = { select, write, last: UNSET };
    apply(writer.current, ref.current, store.getState());
  });
  useLayoutEffect(() => store.subscribe((s) => apply(writer.current, ref.current, s)), [store]);
  return ref;
}

/**
 * Set `el`'s text, touching the DOM only when it differs. The existing text node is changed in
 * place: replacing it (textContent =) makes the browser build a new layout object each time,
 * which costs several times more layout on a sheet with hundreds of readings.
 */
export function setText(el: HTMLElement, text: string): void {
  const node = el.firstChild;
  // no text: no text node, so `:empty` styles apply
  if (text && node && node === el.lastChild && node.nodeType === Node.TEXT_NODE) {
    if ((node as Text).data !== text) (node as Text).data = text;
  } else if (el.textContent !== text) el.textContent = text;
}
