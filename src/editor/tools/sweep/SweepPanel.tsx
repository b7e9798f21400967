// Sweep tab: vary one quantity (optionally a second, as a family of curves), plot chosen outputs,
// read values under the cursor, export PNG/CSV, and compare with bench measurements.
import { useMemo, useRef, useState } from 'react';
import type uPlot from 'uplot';
import type { SweepSpec } from '../../../../shared/analysis/sweep';
import { analysisPool } from '../runner/analysisPool';
import { sweepJob } from '../runner/jobs';
import { startRun, type RunHandle } from '../runner/runState';
import { runSetter, useToolSession, type SweepForm } from '../results/toolSession';
import { useToolSheet } from '../useToolSheet';
import { fieldText, fmtQ, readQuantity } from '../format';
import { Button, Field, inputClass, RunStatus, Section } from '../ui';
import { OutputPicker } from '../OutputPicker';
import { plotPng } from '../plot/plotPng';
import { currentPlotTheme } from '../plot/plotTheme';
import { downloadBlob, downloadText, fileStem } from '../export/download';
import { defaultOutputs, outputChoices } from './outputChoices';
import { sweepChoices, type SweepChoice } from './sweepTargets';
import { sweepDataFrom } from './sweepData';
import { sweepCsv } from './sweepCsv';
import { buildSweepPlot } from './plotModel';
import { SweepPlot } from './SweepPlot';
import { BenchCompare } from './BenchCompare';

function initialForm(choices: SweepChoice[], outputs: string[]): SweepForm {
  // a wiper or a supply range is the usual first question; otherwise the first choice
  const first =
    choices.find((c) => c.key.endsWith('.position')) ?? choices.find((c) => c.key.endsWith('.voltage')) ?? choices[0];
  return { targetKey: first.key, from: fieldText(first.from), to: fieldText(first.to), points: 101, scale: first.scale, familyKey: '', familyFrom: '', familyTo: '', familyPoints: 3, outputs };
}

export function SweepPanel() {
  const { sheet, key } = useToolSheet();
  const choices = useMemo(() => sweepChoices(sheet), [sheet]);
  const outputs = useMemo(() => outputChoices(sheet), [sheet]);
  const stored = useToolSession((s) => s.sweepForm);
  const run = useToolSession((s) => s.sweep);
  const bench = useToolSession((s) => s.bench);
  const form = stored && choices.some((c) => c.key === stored.targetKey) ? stored : initialForm(choices, defaultOutputs(outputs, sheet));
  const [problem, setProblem] = useState<string | null>(null);
  const handle = useRef<RunHandle | null>(null);
  const chart = useRef<uPlot | null>(null);
  const set = (patch: Partial<SweepForm>) => useToolSession.setState({ sweepForm: { ...form, ...patch } });

  const pick = (k: string) => {
    const c = choices.find((x) => x.key === k)!;
    set({ targetKey: k, from: fieldText(c.from), to: fieldText(c.to), scale: c.scale, familyKey: form.familyKey === k ? '' : form.familyKey });
  };
  const pickFamily = (k: string) => {
    const c = choices.find((x) => x.key === k);
    set(c ? { familyKey: k, familyFrom: fieldText(c.from), familyTo: fieldText(c.to) } : { familyKey: '' });
  };

  const start = () => {
    const target = choices.find((c) => c.key === form.targetKey)!;
    const from = readQuantity(form.from, target.unit, 'From');
    const to = readQuantity(form.to, target.unit, 'To');
    if (!from.ok || !to.ok) return setProblem((!from.ok ? from.message : '') || (!to.ok ? to.message : ''));
    if (!(form.points >= 2 && form.points <= 5000)) return setProblem('Points: use 2 to 5000 points along the sweep.');
    let spec: SweepSpec = { axes: [{ target: target.target, steps: { from: from.value, to: to.value, points: form.points, scale: form.scale } }] };
    const fam = choices.find((c) => c.key === form.familyKey);
    if (fam) {
      const ff = readQuantity(form.familyFrom, fam.unit, 'Family from');
      const ft = readQuantity(form.familyTo, fam.unit, 'Family to');
      if (!ff.ok || !ft.ok) return setProblem((!ff.ok ? ff.message : '') || (!ft.ok ? ft.message : ''));
      if (!(form.familyPoints >= 2 && form.familyPoints <= 8)) return setProblem('Curves: use 2 to 8 values of the second parameter.');
      spec = { axes: [{ target: fam.target, steps: { from: ff.value, to: ft.value, points: form.familyPoints, scale: fam.scale } }, spec.axes[0]] };
    }
    if (!form.outputs.length) return setProblem('Choose at least one output to plot.');
    setProblem(null);
    handle.current?.cancel();
    const scales = spec.axes.map((a) => a.steps.scale ?? 'linear');
    const snapshot = sheet;
    // keep the form with the result: the report plots the outputs chosen here
    useToolSession.setState({ sheet: snapshot, sweepForm: form });
    handle.current = startRun(
      runSetter('sweep'),
      async (signal, onProgress) => sweepDataFrom(await sweepJob(analysisPool(), snapshot, spec, { signal, onProgress }), scales),
      key,
    );
  };

  const data = run.result;
  const shownOutputs = data ? form.outputs.filter((o) => data.curves[o]) : [];
  const familyLabel = (f: number) => (data?.family ? `${data.family.key} = ${fmtQ(data.family.values[f], data.family.unit)}` : '');
  const model = useMemo(() => (data ? buildSweepPlot(data, shownOutputs, bench, familyLabel) : null), [data, shownOutputs.join('|'), bench]); // eslint-disable-line react-hooks/exhaustive-deps
  const target = choices.find((c) => c.key === form.targetKey)!;
  const stem = fileStem(sheet.title);

  const exportPng = async () => {
    if (!chart.current || !model || !data) return;
    const t = currentPlotTheme();
    const blob = await plotPng(chart.current, `${sheet.title ?? 'Sweep'}: ${shownOutputs.join(', ')} vs ${data.x.key}`, model.series.map((s) => ({ label: s.label, color: t.series[s.color % t.series.length], dot: s.kind === 'measured' })), { background: t.panel, ink: t.ink });
    downloadBlob(blob, `${stem}-sweep.png`);
  };

  return (
    <div data-testid="sweep-panel">
      <Section title="Vary">
        <div className="grid grid-cols-[1fr_auto] gap-2">
          <Field label="Quantity">
            <select className={inputClass} value={form.targetKey} onChange={(e) => pick(e.target.value)} data-testid="sweep-target">
              {choices.map((c) => (
                <option key={c.key} value={c.key}>
                  {c.label}{c.unit ? ` (${c.unit})` : ''}
                </option>
              ))}
            </select>
          </Field>
          <Field label="Spacing">
            <select className={inputClass} value={form.scale} onChange={(e) => set({ scale: e.target.value as 'linear' | 'log' })}>
              <option value="linear">linear</option>
              <option value="log">log</option>
            </select>
          </Field>
        </div>
        <div className="mt-2 grid grid-cols-3 gap-2">
          <Field label={`From${target.unit ? ` (${target.unit})` : ''}`}>
            <input className={inputClass} value={form.from} onChange={(e) => set({ from: e.target.value })} data-testid="sweep-from" />
          </Field>
          <Field label={`To${target.unit ? ` (${target.unit})` : ''}`}>
            <input className={inputClass} value={form.to} onChange={(e) => set({ to: e.target.value })} data-testid="sweep-to" />
          </Field>
          <Field label="Points">
            <input className={inputClass} type="number" min={2} max={5000} value={form.points} onChange={(e) => set({ points: Number(e.target.value) })} />
          </Field>
        </div>
        <details className="mt-2 text-xs" open={!!form.familyKey}>
          <summary className="cursor-pointer text-ink-muted">Second parameter (a family of curves)</summary>
          <div className="mt-1 grid grid-cols-[1.6fr_1fr_1fr_0.7fr] gap-2">
            <Field label="Quantity">
              <select className={inputClass} value={form.familyKey} onChange={(e) => pickFamily(e.target.value)}>
                <option value="">none</option>
                {choices.filter((c) => c.key !== form.targetKey).map((c) => (
                  <option key={c.key} value={c.key}>{c.label}</option>
                ))}
              </select>
            </Field>
            <Field label="From"><input className={inputClass} value={form.familyFrom} disabled={!form.familyKey} onChange={(e) => set({ familyFrom: e.target.value })} /></Field>
            <Field label="To"><input className={inputClass} value={form.familyTo} disabled={!form.familyKey} onChange={(e) => set({ familyTo: e.target.value })} /></Field>
            <Field label="Curves"><input className={inputClass} type="number" min={2} max={8} value={form.familyPoints} disabled={!form.familyKey} onChange={(e) => set({ familyPoints: Number(e.target.value) })} /></Field>
          </div>
        </details>
        <div className="mt-2">
          <OutputPicker choices={outputs} selected={form.outputs} onChange={(o) => set({ outputs: o })} testId="sweep-outputs" />
        </div>
        <div className="mt-2 flex items-center gap-2">
          <Button variant="primary" onClick={start} disabled={run.status === 'running'} data-testid="sweep-run">
            Run sweep
          </Button>
          {problem && <span className="text-xs text-danger" role="alert">{problem}</span>}
        </div>
        <RunStatus run={run} stale={run.resultKey !== key} onCancel={() => handle.current?.cancel()} label="Sweep" testId="sweep" />
      </Section>
      {data && model && (
        <Section
          title="Result"
          actions={
            <>
              <Button onClick={exportPng} data-testid="sweep-png">PNG</Button>
              <Button onClick={() => downloadText(sweepCsv(data, shownOutputs), `${stem}-sweep.csv`, 'text/csv')} data-testid="sweep-csv">CSV</Button>
            </>
          }
        >
          {shownOutputs.length === 0 ? (
            <p className="text-xs text-ink-muted">None of the chosen outputs is in this result; run the sweep again.</p>
          ) : (
            <SweepPlot model={model} data={data} chartRef={(u) => (chart.current = u)} />
          )}
          {data.failedPoints > 0 && (
            <p className="mt-1 text-xs text-caution">
              {data.failedPoints} point{data.failedPoints === 1 ? '' : 's'} did not solve (gaps in the curve). {data.errors[0]}
            </p>
          )}
          {model.units.length < new Set(form.outputs.map((o) => data.units[o])).size && (
            <p className="mt-1 text-xs text-ink-muted">A plot shows two units at most; outputs in a third unit are left out.</p>
          )}
        </Section>
      )}
      {data && <BenchCompare data={data} outputs={shownOutputs} outside={model?.outside ?? 0} />}
    </div>
  );
}
