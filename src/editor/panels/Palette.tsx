// The parts palette: every part type, grouped, drawn with its own symbol. Click to place (then
// click on the canvas), or drag onto the canvas; number keys arm the common ones.
import { memo } from 'react';
import type { PartType } from '../../../shared/parts/specs';
import { partSpecs } from '../../../shared/parts/specs';
import { useEditor, useEditorState } from '../EditorContext';
import { PartSymbol } from '../symbols/PartSymbol';
import { PLACE_KEYS } from '../keyboard/shortcuts';
import { PART_DRAG_MIME } from '../canvas/SchematicCanvas';

const GROUPS: ReadonlyArray<{ title: string; types: PartType[] }> = [
  { title: 'Resistive', types: ['resistor', 'potentiometer', 'ntc', 'ldr', 'load', 'switch'] },
  { title: 'Sources', types: ['dc_voltage_source', 'dc_current_source'] },
  { title: 'Semiconductors', types: ['diode', 'zener', 'led', 'npn', 'pnp'] },
  { title: 'Connections', types: ['ground', 'net_label'] },
];

const SHORT: Partial<Record<PartType, string>> = {
  dc_voltage_source: 'Voltage source',
  dc_current_source: 'Current source',
  ldr: 'Light sensor (LDR)',
  ntc: 'Thermistor (NTC)',
  npn: 'NPN transistor',
  pnp: 'PNP transistor',
  net_label: 'Net label',
};

/**
 * Names for the narrow palette (below 1280 px): trade abbreviations where they exist. The visible
 * name is the button's accessible name (label in name); the tooltip, its description, gives the
 * full name.
 */
const COMPACT: Record<PartType, string> = {
  resistor: 'Resistor',
  potentiometer: 'Pot',
  ntc: 'NTC',
  ldr: 'LDR',
  load: 'Load',
  switch: 'Switch',
  dc_voltage_source: 'V source',
  dc_current_source: 'I source',
  diode: 'Diode',
  zener: 'Zener',
  led: 'LED',
  npn: 'NPN',
  pnp: 'PNP',
  ground: 'Ground',
  net_label: 'Net label',
};

export function paletteLabel(type: PartType): string {
  return SHORT[type] ?? partSpecs[type].label;
}

export const Palette = memo(function Palette() {
  const editor = useEditor();
  const tool = useEditorState((s) => s.session.tool);
  const readOnly = useEditorState((s) => s.session.readOnly);
  const style = useEditorState((s) => s.session.symbolStyle);
  return (
    <nav aria-label="Parts" className="flex h-full flex-col gap-3 overflow-y-auto px-2 py-3">
      {GROUPS.map((g) => (
        <section key={g.title}>
          <h2 className="px-1 pb-1 text-[10px] font-semibold uppercase tracking-wider text-ink-muted">{g.title}</h2>
          <ul className="flex flex-col gap-px">
            {g.types.map((type) => {
              const active = tool.kind === 'place' && tool.partType === type;
              const key = PLACE_KEYS[type];
              return (
                <li key={type}>
                  <button
                    type="button"
                    disabled={readOnly}
                    draggable={!readOnly}
                    onDragStart={(e) => {
                      e.dataTransfer.setData(PART_DRAG_MIME, type);
                      e.dataTransfer.effectAllowed = 'copy';
                    }}
                    onClick={() => editor.actions.setTool(active ? { kind: 'select' } : { kind: 'place', partType: type })}
                    className={`group flex w-full items-center gap-2 rounded px-1.5 py-1 text-left text-[13px] disabled:opacity-40 ${
                      active ? 'bg-accent text-accent-ink' : 'text-ink hover:bg-sunken'
                    }`}
                    aria-pressed={active}
                    // Named by its visible label (WCAG 2.5.3, label in name); the symbol and the key hint
                    // are hidden from the name, the key is announced through aria-keyshortcuts.
                    aria-keyshortcuts={key}
                    title={`${paletteLabel(type)}: ${partSpecs[type].description}${key ? ` (key ${key})` : ''}`}
                    data-testid={`palette-${type}`}
                  >
                    <span className={`flex h-7 w-10 shrink-0 items-center justify-center max-xl:w-8 ${active ? '[&_.sym-body]:fill-transparent! [&_.tl-symbol]:text-accent-ink' : ''}`}>
                      <PartSymbol type={type} style={style} scale={type === 'ground' ? 0.55 : 0.42} />
                    </span>
                    {/* one of the two shows (the other is display: none), and it names the button */}
                    <span className="min-w-0 flex-1 truncate max-xl:hidden">{paletteLabel(type)}</span>
                    <span className="min-w-0 flex-1 truncate xl:hidden">{COMPACT[type]}</span>
                    {key && (
                      <kbd aria-hidden="true" className={`num rounded border px-1 text-[10px] ${active ? 'border-accent-ink/40' : 'border-rule text-ink-muted'}`}>{key}</kbd>
                    )}
                  </button>
                </li>
              );
            })}
          </ul>
        </section>
      ))}
      <p className="mt-auto px-1 text-[11px] leading-snug text-ink-muted">
        Pick a part, then click the canvas (Shift keeps placing). Drag from a pin to another pin to wire.
      </p>
    </nav>
  );
});
