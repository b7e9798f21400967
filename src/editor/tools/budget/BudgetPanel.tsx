// Budget tab: what the supplies deliver, each part's stress against its derated rating, and the
// Thevenin equivalent at a chosen net. Reads the editor's live operating point, so it follows
// every edit; the Thevenin probe runs in the analysis pool.
import { useEffect, useMemo, useRef } from 'react';
import { extractNets } from '../../../../shared/sheet';
import { powerBudget, type BudgetResult } from '../../../../shared/analysis/budgets';
import type { SolveSuccess as EngineSuccess } from '../../../../shared/engine/result';
import { useSolveState } from '../../EditorContext';
import { analysisPool } from '../runner/analysisPool';
import { theveninJob } from '../runner/jobs';
import { startRun, type RunHandle } from '../runner/runState';
import { runSetter, useToolSession } from '../results/toolSession';
import { useToolSheet } from '../useToolSheet';
import { fmtPct, fmtQ } from '../format';
import { Field, inputClass, RunStatus, Section } from '../ui';
import { CautionList } from '../cautions/CautionList';
import { toolCautions } from '../cautions/toolCautions';
import { StressTable } from './StressTable';

export function BudgetPanel() {
  const { sheet, key } = useToolSheet();
  const result = useSolveState((s) => s.result);
  const status = useSolveState((s) => s.status);
  const budget = useMemo<BudgetResult | null>(() => {
    if (!result) return null;
    try {
      // the worker returns the engine's full result (with conditions); the editor's type omits them
      return powerBudget(sheet, result as unknown as EngineSuccess);
    } catch {
      return null;
    }
  }, [sheet, result]);
  const cautions = useMemo(() => toolCautions(sheet, result, budget), [sheet, result, budget]);
  const nets = useMemo(() => extractNets(sheet).nets.filter((n) => !n.isGround).map((n) => n.name), [sheet]);
  const chosen = useToolSession((s) => s.budgetNet);
  const thev = useToolSession((s) => s.thevenin);
  const net = nets.includes(chosen) ? chosen : (nets.find((n) => !/^N\d+$/.test(n)) ?? nets[0] ?? '');
  const handle = useRef<RunHandle | null>(null);

  useEffect(() => {
    if (!net || status !== 'ok') return;
    handle.current?.cancel();
    const snapshot = sheet;
    handle.current = startRun(runSetter('thevenin'), (signal) => theveninJob(analysisPool(), snapshot, net, { signal }), key);
    return () => handle.current?.cancel();
    // re-probe when the circuit (not its layout) or the net changes
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [net, key, status]);

  if (!result || !budget)
    return (
      <div className="p-3 text-xs text-ink-muted" data-testid="budget-panel">
        {status === 'error' ? 'The sheet does not solve, so there is no budget to show; see the Checks tab.' : 'Waiting for the operating point…'}
      </div>
    );
  const t = thev.result;
  return (
    <div data-testid="budget-panel">
      {cautions.length > 0 && (
        <Section title="Cautions">
          <CautionList cautions={cautions} />
        </Section>
      )}
      <Section title="Supplies">
        <p className="text-sm">
          Total supply current <span className="num font-semibold" data-testid="budget-total-current">{fmtQ(budget.totalSupplyCurrent, 'A')}</span>
          <span className="text-ink-muted">, power delivered </span>
          <span className="num">{fmtQ(budget.totalSupplyPower, 'W')}</span>
        </p>
        <table className="tl-table num mt-1">
          <thead>
            <tr><th>supply</th><th className="r">current out</th><th className="r">power</th><th className="r">share</th></tr>
          </thead>
          <tbody>
            {budget.supplies.map((s) => (
              <tr key={s.part}>
                <td>{s.part}</td>
                <td className="r">{fmtQ(s.current, 'A')}</td>
                <td className="r">{fmtQ(s.power, 'W')}</td>
                <td className="r">{budget.totalSupplyPower ? fmtPct(s.power / budget.totalSupplyPower, 3) : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-1 text-[11px] text-ink-muted">A divider or reference draws this current all the time: on a battery it is the standing drain.</p>
      </Section>
      <Section title="Dissipation and ratings">
        <StressTable stress={budget.stress} />
      </Section>
      <Section title="Thevenin equivalent">
        <Field label="At net">
          <select className={inputClass} value={net} onChange={(e) => useToolSession.setState({ budgetNet: e.target.value })} data-testid="thevenin-net">
            {nets.map((n) => <option key={n} value={n}>{n}</option>)}
          </select>
        </Field>
        {t && t.net === net && (
          <dl className="num mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs" data-testid="thevenin-result">
            <dt className="text-ink-muted">open-circuit voltage</dt><dd>{fmtQ(t.openCircuitVoltage, 'V')}</dd>
            <dt className="text-ink-muted">source resistance</dt><dd className="font-semibold">{fmtQ(t.resistance, 'Ω')}</dd>
            <dt className="text-ink-muted">short-circuit current</dt><dd>{fmtQ(t.shortCircuitCurrent, 'A')}</dd>
          </dl>
        )}
        {t?.smallSignal && t.net === net && (
          <p className="mt-1 text-[11px] text-ink-muted">The circuit has diodes or transistors: this is the small-signal resistance at the present operating point, good for light loads only.</p>
        )}
        <p className="mt-1 text-[11px] text-ink-muted">An ADC or meter on this net sees this source resistance; keep it well below the input’s own resistance and within the ADC’s sampling limit.</p>
        <RunStatus run={thev} stale={false} onCancel={() => handle.current?.cancel()} label="Thevenin probe" testId="thevenin" />
      </Section>
    </div>
  );
}
