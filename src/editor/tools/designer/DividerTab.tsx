// Divider designer: ask for a tap voltage within a current (or size) budget, rank E-series pairs,
// and drop the chosen one into the sheet, wired between two nets or free.
import { useMemo, useState } from 'react';
import { designDivider, type DividerCandidate, type DividerDesign } from '../../../../shared/design';
import { E_SERIES_NAMES } from '../../../../shared/units';
import { extractNets, GROUND_NET } from '../../../../shared/sheet';
import { useEditor } from '../../EditorContext';
import { notify } from '../../notices';
import { useToolSheet } from '../useToolSheet';
import { fmtPct, fmtQ } from '../format';
import { Button, Field, inputClass } from '../ui';
import { initialDividerForm, readDividerForm, type DividerFormState } from './dividerForm';
import { insertDivider, type DividerPlacement } from './insertParts';
import { useDesignerUi } from './DesignerDialog';

export function DividerTab() {
  const editor = useEditor();
  const { sheet } = useToolSheet();
  const [form, setForm] = useState<DividerFormState>(() => initialDividerForm(sheet));
  const [design, setDesign] = useState<DividerDesign | null>(null);
  const [chosen, setChosen] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const nets = useMemo(() => extractNets(sheet).nets.map((n) => n.name), [sheet]);
  const supplyNet = useMemo(() => {
    const v = sheet.parts.find((p) => p.type === 'dc_voltage_source');
    return v ? (extractNets(sheet).pinToNet[`${v.id}.pos`] ?? '') : '';
  }, [sheet]);
  const [placement, setPlacement] = useState<DividerPlacement>(() =>
    supplyNet ? { kind: 'between', top: supplyNet, bottom: GROUND_NET, tap: '' } : { kind: 'free' },
  );
  const set = (p: Partial<DividerFormState>) => setForm((f) => ({ ...f, ...p }));
  const read = readDividerForm(form);

  const run = () => {
    if (!read.ok) return setError(read.message);
    setError(null);
    const d = designDivider(read.spec);
    setDesign(d);
    setChosen(0);
    if (!d.ok) setError(d.message);
  };
  const insert = (c: DividerCandidate) => {
    if (!read.ok) return;
    const r = insertDivider(editor, { top: c.top, bottom: c.bottom }, placement, { tolerance: read.tolerance, powerRating: read.powerRating });
    if (!r.ok) return setError(r.message ?? 'Could not insert the divider.');
    notify(`Inserted ${c.top.expression} / ${c.bottom.expression}; the tap is net “${r.tapNet}”. Undo removes it in one step.`);
    useDesignerUi.getState().close();
  };
  const candidates = design?.ok ? design.candidates : [];

  return (
    <div className="p-3 text-sm" data-testid="divider-designer">
      <div className="grid grid-cols-4 gap-2">
        <Field label="Supply, nominal (V)"><input className={inputClass} value={form.supply} onChange={(e) => set({ supply: e.target.value })} data-testid="dd-supply" /></Field>
        <Field label="Supply min (V)"><input className={inputClass} value={form.supplyMin} placeholder="= nominal" onChange={(e) => set({ supplyMin: e.target.value })} /></Field>
        <Field label="Supply max (V)"><input className={inputClass} value={form.supplyMax} placeholder="= nominal" onChange={(e) => set({ supplyMax: e.target.value })} /></Field>
        <Field label="Wanted tap voltage (V)"><input className={inputClass} value={form.target} onChange={(e) => set({ target: e.target.value })} data-testid="dd-target" /></Field>
        <Field label="Load on the tap">
          <select className={inputClass} value={form.loadKind} onChange={(e) => set({ loadKind: e.target.value as DividerFormState['loadKind'] })}>
            <option value="none">none</option>
            <option value="resistance">resistance (Ω)</option>
            <option value="current">current drawn (A)</option>
          </select>
        </Field>
        <Field label="Load value"><input className={inputClass} value={form.load} disabled={form.loadKind === 'none'} onChange={(e) => set({ load: e.target.value })} /></Field>
        <Field label="Budget">
          <select className={inputClass} value={form.budgetKind} onChange={(e) => set({ budgetKind: e.target.value as 'current' | 'total', budget: e.target.value === 'current' ? '100u' : '100k' })}>
            <option value="current">max divider current (A)</option>
            <option value="total">total resistance (Ω)</option>
          </select>
        </Field>
        <Field label={form.budgetKind === 'current' ? 'Max current (A)' : 'R1 + R2 (Ω)'}><input className={inputClass} value={form.budget} onChange={(e) => set({ budget: e.target.value })} data-testid="dd-budget" /></Field>
        <Field label="Tolerance (± %)"><input className={inputClass} value={form.tolerancePct} onChange={(e) => set({ tolerancePct: e.target.value })} /></Field>
        <Field label="Series">
          <select className={inputClass} value={form.series} onChange={(e) => set({ series: e.target.value as DividerFormState['series'] })}>
            {E_SERIES_NAMES.map((s) => <option key={s} value={s}>{s}</option>)}
          </select>
        </Field>
        <Field label="Parts per leg">
          <select className={inputClass} value={form.partsPerLeg} onChange={(e) => set({ partsPerLeg: Number(e.target.value) as 1 | 2 })}>
            <option value={1}>1</option>
            <option value={2}>up to 2 (series or parallel)</option>
          </select>
        </Field>
        <Field label="Power rating (W)"><input className={inputClass} value={form.powerRating} onChange={(e) => set({ powerRating: e.target.value })} /></Field>
      </div>
      <div className="mt-2 flex items-center gap-2">
        <Button variant="primary" onClick={run} data-testid="dd-run">Find dividers</Button>
        {error && <span className="text-xs text-danger" role="alert">{error}</span>}
      </div>
      {design?.ok && design.warnings.map((w) => <p key={w} className="mt-2 rounded border-l-4 border-danger bg-sunken px-2 py-1 text-xs">{w}</p>)}
      {design?.ok && candidates.length === 0 && <p className="mt-2 text-xs text-ink-muted">No pair in this budget comes within 10 % of the target; widen the budget or allow two parts per leg.</p>}
      {candidates.length > 0 && (
        <>
          <div className="mt-3 max-h-64 overflow-auto">
            <table className="tl-table num" data-testid="dd-candidates">
              <thead>
                <tr>
                  <th /><th>R1 (top)</th><th>R2 (bottom)</th><th className="r">output</th><th className="r">error</th><th className="r">worst case</th>
                  <th className="r">current</th><th className="r">R<sub>th</sub></th><th className="r">hottest</th><th className="r">score</th>
                </tr>
              </thead>
              <tbody>
                {candidates.map((c, i) => {
                  const hottest = Math.max(...c.dissipation.top, ...c.dissipation.bottom);
                  return (
                    <tr key={`${c.top.expression}|${c.bottom.expression}`} className={c.warnings.length ? 'is-caution' : ''} onClick={() => setChosen(i)} style={{ cursor: 'pointer' }}>
                      <td><input type="radio" name="dd-pick" checked={chosen === i} onChange={() => setChosen(i)} aria-label={`Choose ${c.top.expression} / ${c.bottom.expression}`} /></td>
                      <td>{c.top.expression}</td>
                      <td>{c.bottom.expression}</td>
                      <td className="r">{fmtQ(c.output, 'V')}</td>
                      <td className="r">{fmtPct(c.error, 2)}</td>
                      <td className="r">{fmtQ(c.window.min, 'V')} … {fmtQ(c.window.max, 'V')}</td>
                      <td className="r">{fmtQ(c.quiescentCurrent, 'A', 3)}</td>
                      <td className="r">{fmtQ(c.thevenin, 'Ω', 3)}</td>
                      <td className="r">{fmtQ(hottest, 'W', 2)}</td>
                      <td className="r" title={`error ${c.score.components.error.toFixed(2)}, window ${c.score.components.window.toFixed(2)}, current ${c.score.components.current.toFixed(2)}, parts ${c.score.components.partCount}`}>{c.score.total.toFixed(2)}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          {candidates[chosen]?.warnings.map((w) => <p key={w} className="mt-1 rounded border-l-4 border-caution bg-sunken px-2 py-1 text-xs">{w}</p>)}
          <fieldset className="mt-3 flex flex-wrap items-end gap-3 text-xs">
            <legend className="mb-1 text-ink-muted">Put it in the sheet</legend>
            <label className="flex items-center gap-1">
              <input type="radio" checked={placement.kind === 'between'} disabled={!nets.length} onChange={() => setPlacement({ kind: 'between', top: supplyNet || nets[0], bottom: GROUND_NET, tap: '' })} />
              wired between nets
            </label>
            {placement.kind === 'between' && (
              <>
                <Field label="top">
                  <select className={inputClass} value={placement.top} onChange={(e) => setPlacement({ ...placement, top: e.target.value })} data-testid="dd-top-net">
                    {nets.map((n) => <option key={n} value={n}>{n}</option>)}
                  </select>
                </Field>
                <Field label="tap">
                  <select className={inputClass} value={placement.tap} onChange={(e) => setPlacement({ ...placement, tap: e.target.value })}>
                    <option value="">new label</option>
                    {nets.map((n) => <option key={n} value={n}>{n}</option>)}
                  </select>
                </Field>
                <Field label="bottom">
                  <select className={inputClass} value={placement.bottom} onChange={(e) => setPlacement({ ...placement, bottom: e.target.value })}>
                    {[GROUND_NET, ...nets.filter((n) => n !== GROUND_NET)].map((n) => <option key={n} value={n}>{n === GROUND_NET ? '0 (ground)' : n}</option>)}
                  </select>
                </Field>
              </>
            )}
            <label className="flex items-center gap-1">
              <input type="radio" checked={placement.kind === 'free'} onChange={() => setPlacement({ kind: 'free' })} />
              placed free (wire it yourself)
            </label>
            <Button variant="primary" className="ml-auto" onClick={() => insert(candidates[chosen])} data-testid="dd-insert">
              Insert {candidates[chosen]?.top.expression} / {candidates[chosen]?.bottom.expression}
            </Button>
          </fieldset>
        </>
      )}
    </div>
  );
}
