// The "Part" tab: what is selected, its designator, tolerance corner, parameters and readings.
import { useState } from 'react';
import { partSpecs } from '../../../shared/parts/specs';
import type { Part } from '../../../shared/sheet';
import { useEditor, useEditorState, useSolveState } from '../EditorContext';
import { ParamForm } from './ParamForm';
import { PotSlider } from '../canvas/PotSlider';
import { hasCorners } from '../solve/corners';
import { PartReadings } from './PartReadings';
import { WarningList } from './WarningList';
import type { Corner } from '../model/scopes';
import { E_SERIES_NAMES, isESeriesName } from '../../../shared/units';

function DesignatorField({ part }: { part: Part }) {
  const editor = useEditor();
  const readOnly = useEditorState((s) => s.session.readOnly);
  const [text, setText] = useState(part.id);
  const [error, setError] = useState<string | null>(null);
  const commit = () => {
    if (text.trim() === part.id) return setError(null);
    const problem = editor.actions.rename(part.id, text);
    setError(problem);
  };
  return (
    <div>
      <label className="flex items-center gap-2">
        <span className="sr-only">Designator</span>
        <input
          value={text}
          disabled={readOnly}
          onChange={(e) => setText(e.target.value)}
          onBlur={commit}
          onKeyDown={(e) => {
            if (e.key === 'Enter') commit();
            if (e.key === 'Escape') {
              setText(part.id);
              setError(null);
            }
          }}
          aria-label="Designator"
          aria-invalid={!!error}
          data-testid="designator-input"
          spellCheck={false}
          className={`num w-28 rounded border bg-panel px-1.5 py-0.5 text-[15px] font-semibold ${error ? 'border-danger' : 'border-rule'} focus:border-accent`}
        />
      </label>
      {error && (
        <p role="alert" className="mt-1 text-[11px] text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

function CornerSwitch({ part }: { part: Part }) {
  const editor = useEditor();
  const corner = useEditorState((s) => s.session.corners[part.id]);
  const options: Array<[Corner | null, string]> = [[null, 'nominal'], ['min', 'min'], ['max', 'max']];
  return (
    <div>
      <div className="mb-1 text-[12px] text-ink-muted">Solve this part at its tolerance</div>
      <div role="radiogroup" aria-label={`${part.id} tolerance corner`} className="inline-flex rounded border border-rule p-0.5">
        {options.map(([c, label]) => {
          const on = (corner ?? null) === c;
          return (
            <button
              key={label}
              type="button"
              role="radio"
              aria-checked={on}
              onClick={() => editor.actions.setCorner(part.id, c)}
              data-testid={`corner-${label}`}
              className={`rounded-sm px-2.5 py-0.5 text-[12px] ${on ? 'bg-accent text-accent-ink' : 'text-ink-muted hover:text-ink'}`}
            >
              {label}
            </button>
          );
        })}
      </div>
      <p className="mt-1 text-[11px] leading-snug text-ink-muted">A what-if for this session only; the sheet keeps the nominal value.</p>
    </div>
  );
}

function SeriesPicker() {
  const editor = useEditor();
  const series = useEditorState((s) => s.session.snapSeries);
  return (
    <label className="flex items-center gap-1 text-[12px] text-ink-muted">
      Snap to
      <select
        value={series}
        onChange={(e) => isESeriesName(e.target.value) && editor.actions.setSnapSeries(e.target.value)}
        className="num rounded border border-rule bg-panel px-1 py-0.5 text-[12px] text-ink"
        aria-label="E-series for snapping"
      >
        {E_SERIES_NAMES.map((n) => <option key={n} value={n}>{n}</option>)}
      </select>
    </label>
  );
}

export function PropertyPanel() {
  const editor = useEditor();
  const selection = useEditorState((s) => s.session.selection);
  const parts = useEditorState((s) => s.doc.parts);
  const selected = parts.filter((p) => selection.parts.includes(p.id));
  // this part's findings only (kept as the same array while they do not change)
  const partWarnings = useSolveState((s) => (selected.length === 1 ? s.byPart[selected[0].id] : undefined));

  if (selected.length === 0)
    return (
      <div className="p-4 text-[13px] leading-relaxed text-ink-muted">
        {selection.wires.length ? (
          <p>{selection.wires.length === 1 ? 'One wire' : `${selection.wires.length} wires`} selected. Press Delete to remove.</p>
        ) : (
          <>
            <p>Select a part to see and edit its values.</p>
            <p className="mt-2">Values take engineering or RKM notation: <span className="num text-ink">4.7k</span>, <span className="num text-ink">4k7</span>, <span className="num text-ink">R47</span>, <span className="num text-ink">10 µA</span>.</p>
            <p className="mt-2">Press <kbd className="num rounded border border-rule px-1">?</kbd> for every shortcut.</p>
          </>
        )}
      </div>
    );
  if (selected.length > 1)
    return (
      <div className="flex flex-col gap-3 p-4 text-[13px]">
        <p>
          <span className="font-medium">{selected.length} parts</span> selected: <span className="num">{selected.map((p) => p.id).join(', ')}</span>
        </p>
        <div className="flex gap-2">
          <button type="button" className="rounded border border-rule px-2 py-1 hover:bg-sunken" onClick={() => editor.actions.rotateSelection()}>Rotate</button>
          <button type="button" className="rounded border border-rule px-2 py-1 hover:bg-sunken" onClick={() => editor.actions.duplicateSelection()}>Duplicate</button>
          <button type="button" className="rounded border border-danger/50 px-2 py-1 text-danger hover:bg-sunken" onClick={() => editor.actions.deleteSelection()}>Delete</button>
        </div>
      </div>
    );

  const part = selected[0];
  const spec = partSpecs[part.type];
  return (
    <div className="flex flex-col gap-4 p-4" data-testid="property-panel">
      <header className="flex items-start justify-between gap-2">
        <div>
          {/* keyed by id: a rename elsewhere (undo, a colleague) shows the new id */}
          <DesignatorField key={part.id} part={part} />
          <div className="mt-1 text-[12px] text-ink-muted">{spec.label}</div>
        </div>
        {spec.params.some((p) => p.unit === 'Ω' && !p.toleranceOf) && <SeriesPicker />}
      </header>
      {partWarnings?.length ? <WarningList warnings={partWarnings} compact /> : null}
      {part.type === 'potentiometer' && (
        <div>
          <div className="mb-1 text-[12px] text-ink-muted">Wiper</div>
          <PotSlider part={part} wide />
        </div>
      )}
      <ParamForm key={part.id} part={part} />
      {hasCorners(part) && <CornerSwitch part={part} />}
      <PartReadings part={part} />
    </div>
  );
}
