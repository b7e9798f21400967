// The report's sections that come from the live operating point: readings, findings, budget,
// parts list. (The analysis sections are in ReportAnalyses.tsx.)
import { useMemo } from 'react';
import { partsList } from '../../shared/design';
import { powerBudget } from '../../shared/analysis/budgets';
import type { SolveSuccess as EngineSuccess } from '../../shared/engine/result';
import { formatTolerance } from '../../shared/units';
import { useEditorState, useSolveState } from '../editor/EditorContext';
import { netRows, partRows } from '../editor/panels/readingsRows';
import { WarningList } from '../editor/panels/WarningList';
import { StressTable } from '../editor/tools/budget/StressTable';
import { CautionList } from '../editor/tools/cautions/CautionList';
import { SAFETY_NOTE, toolCautions } from '../editor/tools/cautions/toolCautions';
import { fmtQ } from '../editor/tools/format';

export function useReportBudget() {
  const sheet = useEditorState((s) => s.doc);
  const result = useSolveState((s) => s.result);
  return useMemo(() => {
    if (!result) return null;
    try {
      return powerBudget(sheet, result as unknown as EngineSuccess);
    } catch {
      return null;
    }
  }, [sheet, result]);
}

export function SafetySection() {
  const sheet = useEditorState((s) => s.doc);
  const result = useSolveState((s) => s.result);
  const budget = useReportBudget();
  const cautions = useMemo(() => toolCautions(sheet, result, budget), [sheet, result, budget]);
  return (
    <section data-testid="report-safety">
      <div className="rounded border border-rule bg-sunken px-3 py-2 text-[12px]" role="note">
        <strong>Safety note.</strong> {SAFETY_NOTE}
      </div>
      {cautions.length > 0 && <div className="mt-2"><CautionList cautions={cautions} testId="report-cautions" /></div>}
    </section>
  );
}

export function OperatingPointSection() {
  const sheet = useEditorState((s) => s.doc);
  const status = useSolveState((s) => s.status);
  const result = useSolveState((s) => s.result);
  const failure = useSolveState((s) => s.failure);
  const pinNets = useSolveState((s) => s.pinNets);
  const warnings = useSolveState((s) => s.warnings);
  if (status === 'idle') return <section><h2>Operating point</h2><p className="text-sm text-ink-muted">Solving…</p></section>;
  return (
    <>
      <section className="can-split" data-testid="report-operating-point">
        <h2>Operating point</h2>
        <p className="mb-2 text-[12px] text-ink-muted">
          At {sheet.conditions.temperatureC} °C and {sheet.conditions.illuminanceLux} lx, nominal part values.
        </p>
        {!result && <p className="text-sm text-danger">The sheet does not solve: {failure?.error.message}</p>}
        {result && (
          <div className="grid grid-cols-2 gap-6 max-md:grid-cols-1 print:grid-cols-2">
            <table className="tl-table num">
              <thead><tr><th>net</th><th className="r">voltage</th></tr></thead>
              <tbody>
                {netRows(result, pinNets).map((r) => (
                  <tr key={r.net}><td>{r.net}</td><td className="r">{fmtQ(r.voltage, 'V')}</td></tr>
                ))}
              </tbody>
            </table>
            <table className="tl-table num">
              <thead><tr><th>part</th><th className="r">current</th><th className="r">power</th></tr></thead>
              <tbody>
                {partRows(result, sheet).map((r) => (
                  <tr key={r.part}><td>{r.part}</td><td className="r">{fmtQ(r.current, 'A')}</td><td className="r">{fmtQ(r.power, 'W')}</td></tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      <section data-testid="report-warnings">
        <h2>Findings</h2>
        {warnings.length ? <WarningList warnings={warnings} /> : <p className="text-sm text-ink-muted">No warnings at the operating point.</p>}
      </section>
    </>
  );
}

export function BudgetSection() {
  const budget = useReportBudget();
  if (!budget) return null;
  return (
    <section data-testid="report-budget">
      <h2>Supply current and dissipation</h2>
      <p className="mb-2 text-sm">
        Total supply current <span className="num font-semibold">{fmtQ(budget.totalSupplyCurrent, 'A')}</span>, power delivered{' '}
        <span className="num">{fmtQ(budget.totalSupplyPower, 'W')}</span>.
      </p>
      <StressTable stress={budget.stress} />
    </section>
  );
}

export function PartsListSection() {
  const sheet = useEditorState((s) => s.doc);
  const rows = useMemo(() => partsList(sheet), [sheet]);
  return (
    <section className="can-split" data-testid="report-parts-list">
      <h2>Parts list</h2>
      <table className="tl-table num">
        <thead><tr><th>designators</th><th className="r">qty</th><th>part</th><th>value</th><th>RKM</th><th>tolerance</th><th>rating</th></tr></thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.designators.join(',')}>
              <td>{r.designators.join(', ')}</td>
              <td className="r">{r.quantity}</td>
              <td>{r.typeLabel}</td>
              <td>{r.value}</td>
              <td>{r.valueRkm ?? ''}</td>
              <td>{r.tolerance !== null ? formatTolerance(r.tolerance) : ''}</td>
              <td>{r.powerRating !== null ? fmtQ(r.powerRating, 'W', 3) : ''}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-[11px] text-ink-muted">Supplies, loads, grounds and net labels stand for the world around the circuit and are not listed.</p>
    </section>
  );
}
