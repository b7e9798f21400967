// Value finder: the nearest preferred value, or a series/parallel combination, for a resistance.
// Drops the combination into the sheet, or sets the selected resistor to a single value.
import { useState } from 'react';
import { findValue, type ValueFinderResult, type ValueMatch } from '../../../../shared/design';
import { E_SERIES_NAMES, type ESeriesName } from '../../../../shared/units';
import { useEditor, useEditorState } from '../../EditorContext';
import { notify } from '../../notices';
import { fmtPct, fmtQ, readQuantity } from '../format';
import { Button, Field, inputClass } from '../ui';
import { insertCombination } from './insertParts';
import { useDesignerUi } from './DesignerDialog';

export function ValueFinderTab() {
  const editor = useEditor();
  const selectedResistor = useEditorState((s) => {
    const ids = s.session.selection.parts;
    const p = ids.length === 1 ? s.doc.parts.find((x) => x.id === ids[0]) : undefined;
    return p?.type === 'resistor' ? p.id : null;
  });
  const [target, setTarget] = useState('4k99');
  const [series, setSeries] = useState<ESeriesName>('E24');
  const [maxParts, setMaxParts] = useState<1 | 2 | 3>(2);
  const [tolerancePct, setTolerancePct] = useState('1');
  const [result, setResult] = useState<ValueFinderResult | null>(null);
  const [error, setError] = useState<string | null>(null);

  const run = () => {
    const t = readQuantity(target, 'Ω', 'Target resistance');
    if (!t.ok) return setError(t.message);
    if (!(t.value > 0)) return setError('Target resistance: must be above 0 Ω.');
    setError(null);
    setResult(findValue(t.value, { series, maxParts, limit: 12 }));
  };
  const tol = Number(tolerancePct) / 100;
  const insert = (m: ValueMatch) => {
    if (!(tol >= 0 && tol < 1)) return setError('Tolerance: a percentage from 0 to below 100.');
    const r = insertCombination(editor, m, { tolerance: tol, powerRating: 0.25 });
    if (r.ok) {
      notify(`Inserted ${m.expression} (${r.ids.join(', ')}).`);
      useDesignerUi.getState().close();
    }
  };
  const apply = (m: ValueMatch) => {
    if (!selectedResistor) return;
    editor.actions.setParams(selectedResistor, { resistance: m.parts[0], tolerance: tol }, `Set ${selectedResistor} to ${m.expression}`);
    notify(`${selectedResistor} is now ${m.expression}.`);
    useDesignerUi.getState().close();
  };

  return (
    <div className="p-3 text-sm" data-testid="value-finder">
      <div className="grid grid-cols-4 gap-2">
        <Field label="Target resistance"><input className={inputClass} value={target} onChange={(e) => setTarget(e.target.value)} onKeyDown={(e) => e.key === 'Enter' && run()} data-testid="vf-target" /></Field>
        <Field label="Series">
          <select className={inputClass} value={series} onChange={(e) => setSeries(e.target.value as ESeriesName)}>
            {E_SERIES_NAMES.map((s) => <option key={s} value={s}>{s}</option>)}
          </select>
        </Field>
        <Field label="Parts at most">
          <select className={inputClass} value={maxParts} onChange={(e) => setMaxParts(Number(e.target.value) as 1 | 2 | 3)}>
            <option value={1}>1</option><option value={2}>2</option><option value={3}>3</option>
          </select>
        </Field>
        <Field label="Tolerance (± %)"><input className={inputClass} value={tolerancePct} onChange={(e) => setTolerancePct(e.target.value)} /></Field>
      </div>
      <div className="mt-2 flex items-center gap-2">
        <Button variant="primary" onClick={run} data-testid="vf-run">Find values</Button>
        {error && <span className="text-xs text-danger" role="alert">{error}</span>}
      </div>
      {result && (
        <table className="tl-table num mt-3" data-testid="vf-results">
          <thead>
            <tr><th>combination</th><th className="r">value</th><th className="r">error</th><th /></tr>
          </thead>
          <tbody>
            {result.ranked.map((m) => (
              <tr key={m.expression}>
                <td>{m.expression}</td>
                <td className="r">{fmtQ(m.value, 'Ω', 5)}</td>
                <td className="r">{fmtPct(m.error, 3)}</td>
                <td className="r">
                  {m.topology === 'single' && selectedResistor && <Button className="mr-1" onClick={() => apply(m)}>Set {selectedResistor}</Button>}
                  <Button onClick={() => insert(m)}>Insert</Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
