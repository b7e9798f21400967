// The "?" overlay: every shortcut and mouse gesture of the editor.
import { useEffect, useRef } from 'react';
import { SHORTCUTS, PLACE_KEYS, displayKeys } from '../keyboard/shortcuts';
import { paletteLabel } from './Palette';
import type { PartType } from '../../../shared/parts/specs';

const GESTURES: Array<[string, string]> = [
  ['Drag on empty canvas', 'Select parts in a box'],
  ['Shift/Ctrl + click', 'Add to or remove from the selection'],
  ['Drag a pin to a pin', 'Wire them'],
  ['Drop a pin on a pin', 'Touching pins are wired for you'],
  ['Middle / right drag, or Space + drag', 'Pan'],
  ['Wheel', 'Zoom'],
  ['Palette part, then click', 'Place it (Shift + click keeps placing)'],
];

export function ShortcutHelp({ onClose }: { onClose: () => void }) {
  const close = useRef<HTMLButtonElement>(null);
  const mac = typeof navigator !== 'undefined' && /Mac|iPhone|iPad/.test(navigator.platform);
  useEffect(() => {
    close.current?.focus();
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape' || e.key === '?') {
        e.preventDefault();
        e.stopPropagation();
        onClose();
      }
    };
    window.addEventListener('keydown', onKey, true);
    return () => window.removeEventListener('keydown', onKey, true);
  }, [onClose]);
  const groups = ['Edit', 'Select', 'View', 'Sheet'] as const;
  const kbd = (k: string) => (
    <kbd key={k} className="num rounded border border-rule bg-sunken px-1.5 py-px text-[11px]">
      {displayKeys(k, mac)}
    </kbd>
  );
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/30 p-6" onMouseDown={onClose}>
      <div
        role="dialog"
        aria-modal="true"
        aria-labelledby="help-title"
        data-testid="shortcut-help"
        className="max-h-full w-full max-w-3xl overflow-y-auto rounded-md border border-rule bg-panel p-5 shadow-xl"
        onMouseDown={(e) => e.stopPropagation()}
      >
        <div className="mb-3 flex items-center justify-between">
          <h2 id="help-title" className="text-lg font-semibold">Keyboard and mouse</h2>
          <button ref={close} type="button" onClick={onClose} className="rounded border border-rule px-2 py-0.5 text-[12px] hover:bg-sunken">
            Close
          </button>
        </div>
        <div className="grid gap-5 md:grid-cols-2">
          {groups.map((g) => (
            <section key={g}>
              <h3 className="mb-1 text-[11px] font-semibold uppercase tracking-wider text-ink-muted">{g}</h3>
              <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-[13px]">
                {SHORTCUTS.filter((s) => s.group === g).map((s) => (
                  <div key={s.command} className="contents">
                    <dt className="flex flex-wrap gap-1">{s.keys.map(kbd)}</dt>
                    <dd>{s.label}</dd>
                  </div>
                ))}
              </dl>
            </section>
          ))}
          <section>
            <h3 className="mb-1 text-[11px] font-semibold uppercase tracking-wider text-ink-muted">Place</h3>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-[13px]">
              {Object.entries(PLACE_KEYS).map(([type, key]) => (
                <div key={type} className="contents">
                  <dt>{kbd(key!)}</dt>
                  <dd>{paletteLabel(type as PartType)}</dd>
                </div>
              ))}
            </dl>
          </section>
          <section>
            <h3 className="mb-1 text-[11px] font-semibold uppercase tracking-wider text-ink-muted">Mouse</h3>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-[13px]">
              {GESTURES.map(([g, what]) => (
                <div key={g} className="contents">
                  <dt className="text-ink-muted">{g}</dt>
                  <dd>{what}</dd>
                </div>
              ))}
            </dl>
          </section>
        </div>
      </div>
    </div>
  );
}
