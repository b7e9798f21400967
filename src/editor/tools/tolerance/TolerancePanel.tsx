// Tolerance tab: worst case (sensitivities + corners) and Monte Carlo for the chosen outputs,
// run side by side in the worker pool, with a spec window per output for the yield.
import { useMemo, useRef, useState } from 'react';
import { analysisPool } from '../runner/analysisPool';
import { monteCarloJob, worstCaseJob } from '../runner/jobs';
import { startRun, type RunHandle } from '../runner/runState';
import { runSetter, useToolSession, type ToleranceForm } from '../results/toolSession';
import { useToolSheet } from '../useToolSheet';
import { Button, Field, inputClass, RunStatus, Section } from '../ui';
import { OutputPicker } from '../OutputPicker';
import { defaultOutputs, outputChoices } from '../sweep/outputChoices';
import { toleranceRequest } from './toleranceRun';
import { MonteCarloSummary, WorstCaseSummary } from './ToleranceResults';

export function TolerancePanel() {
  const { sheet, key } = useToolSheet();
  const outputs = useMemo(() => outputChoices(sheet), [sheet]);
  const stored = useToolSession((s) => s.toleranceForm);
  const wcRun = useToolSession((s) => s.worstCase);
  const mcRun = useToolSession((s) => s.monteCarlo);
  const form: ToleranceForm = stored ?? { outputs: defaultOutputs(outputs, sheet), samples: 2000, seed: 1, distribution: 'normal', windows: {}, supplyRange: true };
  const set = (patch: Partial<ToleranceForm>) => useToolSession.setState({ toleranceForm: { ...form, ...patch } });
  const [problem, setProblem] = useState<string | null>(null);
  const handles = useRef<RunHandle[]>([]);
  const running = wcRun.status === 'running' || mcRun.status === 'running';

  const start = () => {
    const req = toleranceRequest(form);
    if (!req.ok) return setProblem(req.message);
    setProblem(null);
    for (const h of handles.current) h.cancel();
    const snapshot = sheet;
    useToolSession.setState({ sheet: snapshot, toleranceForm: form });
    const pool = analysisPool();
    handles.current = [
      startRun(runSetter('worstCase'), (signal) => worstCaseJob(pool, snapshot, req.worstCase, { signal }), key),
      startRun(runSetter('monteCarlo'), (signal, onProgress) => monteCarloJob(pool, snapshot, req.monteCarlo, { signal, onProgress }), key),
    ];
  };
  const cancel = () => handles.current.forEach((h) => h.cancel());

  const wc = wcRun.result;
  const mc = mcRun.result;
  const keys = mc?.outputs.map((o) => o.key) ?? wc?.outputs.map((o) => o.key) ?? [];

  return (
    <div data-testid="tolerance-panel">
      <Section title="Spread over tolerances">
        <OutputPicker choices={outputs} selected={form.outputs} onChange={(o) => set({ outputs: o })} max={4} testId="tolerance-outputs" />
        {form.outputs.length > 0 && (
          <div className="mt-2 grid grid-cols-[auto_1fr_1fr] items-end gap-x-2 gap-y-1 text-xs">
            <span className="text-ink-muted">Spec window</span>
            <span className="text-ink-muted">lower limit</span>
            <span className="text-ink-muted">upper limit</span>
            {form.outputs.map((o) => (
              <div key={o} className="contents">
                <span className="num">{o}</span>
                {(['min', 'max'] as const).map((side) => (
                  <input
                    key={side}
                    className={inputClass}
                    placeholder="none"
                    aria-label={`${o} ${side === 'min' ? 'lower' : 'upper'} limit`}
                    data-testid={`spec-${side}-${o}`}
                    value={form.windows[o]?.[side] ?? ''}
                    onChange={(e) => set({ windows: { ...form.windows, [o]: { ...(form.windows[o] ?? { min: '', max: '' }), [side]: e.target.value } } })}
                  />
                ))}
              </div>
            ))}
          </div>
        )}
        <div className="mt-2 grid grid-cols-3 gap-2">
          <Field label="Samples">
            <input className={inputClass} type="number" min={10} max={2000000} step={100} value={form.samples} onChange={(e) => set({ samples: Number(e.target.value) })} data-testid="mc-samples" />
          </Field>
          <Field label="Seed">
            <input className={inputClass} type="number" value={form.seed} onChange={(e) => set({ seed: Number(e.target.value) })} />
          </Field>
          <Field label="Distribution" hint={form.distribution === 'normal' ? '±tolerance = 3σ' : 'flat over ±tolerance'}>
            <select className={inputClass} value={form.distribution} onChange={(e) => set({ distribution: e.target.value as 'normal' | 'uniform' })}>
              <option value="normal">normal</option>
              <option value="uniform">uniform</option>
            </select>
          </Field>
        </div>
        <label className="mt-2 flex items-center gap-1.5 text-xs">
          <input type="checkbox" checked={form.supplyRange} onChange={(e) => set({ supplyRange: e.target.checked })} />
          Vary supplies over their min … max range
        </label>
        <div className="mt-2 flex items-center gap-2">
          <Button variant="primary" onClick={start} disabled={running} data-testid="tolerance-run">
            Run worst case + Monte Carlo
          </Button>
          {problem && <span className="text-xs text-danger" role="alert">{problem}</span>}
        </div>
        <RunStatus run={mcRun} stale={mcRun.resultKey !== key} onCancel={cancel} label="Monte Carlo" testId="mc" />
        {wcRun.status !== 'running' && <RunStatus run={wcRun} stale={false} onCancel={cancel} label="Worst case" testId="wc" />}
      </Section>
      {keys.map((k) => {
        const w = wc?.outputs.find((o) => o.key === k);
        const m = mc?.outputs.find((o) => o.key === k);
        return (
          <Section key={k} title={k} plainTitle>
            {w && <WorstCaseSummary wc={w} />}
            {m && <div className="mt-2"><MonteCarloSummary mc={m} wc={w} /></div>}
          </Section>
        );
      })}
      {mc && (
        <p className="px-3 py-2 text-[11px] text-ink-muted">
          {mc.samples} samples, seed {mc.seed}, {mc.variables.length} varied quantit{mc.variables.length === 1 ? 'y' : 'ies'}
          {mc.failed ? `; ${mc.failed} samples did not solve (counted as out of spec): ${mc.failures[0]?.message}` : ''}.
          {wc && ` Worst case: ${wc.method === 'all-corners' ? 'every corner solved' : 'sensitivity-predicted corners, improved by single flips'} (${wc.solves} solves).`}
        </p>
      )}
    </div>
  );
}
