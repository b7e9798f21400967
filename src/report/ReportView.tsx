// The printable design report of one sheet: schematic, operating point, findings and cautions,
// budget, the sweep and tolerance runs of this tab, parts list.
import { Link } from 'react-router-dom';
import type { Sheet } from '../../shared/sheet';
import { electricalKey } from '../editor/solve/liveSolve';
import type { ToolSessionState } from '../editor/tools/results/toolSession';
import { ReportEditor, ReportSchematic } from './ReportSchematic';
import { BudgetSection, OperatingPointSection, PartsListSection, SafetySection } from './ReportSections';
import { SweepSection, ToleranceSection } from './ReportAnalyses';
import './report.css';
import '../editor/tools/tools.css';

export function ReportView({ sheet, session, backTo }: { sheet: Sheet; session: ToolSessionState | null; backTo: string }) {
  const key = electricalKey(sheet);
  const description = (sheet as { description?: unknown }).description;
  return (
    <article className="tl-report" data-testid="design-report">
      <div className="tl-no-print mb-4 flex items-center gap-2">
        <Link to={backTo} className="rounded border border-rule px-2.5 py-1 text-sm hover:bg-sunken">← Back to the editor</Link>
        <button type="button" className="rounded border border-accent bg-accent px-2.5 py-1 text-sm font-medium text-accent-ink" onClick={() => window.print()} data-testid="report-print">
          Print or save as PDF
        </button>
        <span className="text-[12px] text-ink-muted">Choose “Save as PDF” as the printer to keep a copy.</span>
      </div>
      <header>
        <p className="text-[11px] uppercase tracking-wider text-ink-muted">Tapline design report</p>
        <h1>{sheet.title ?? 'Untitled sheet'}</h1>
        {typeof description === 'string' && <p className="mt-1 text-sm text-ink-muted">{description}</p>}
        <p className="mt-1 text-[12px] text-ink-muted">
          {sheet.parts.length} parts, {sheet.wires.length} wires · conditions {sheet.conditions.temperatureC} °C, {sheet.conditions.illuminanceLux} lx · printed{' '}
          {new Date().toLocaleString([], { dateStyle: 'medium', timeStyle: 'short' })}
        </p>
      </header>
      <ReportEditor sheet={sheet}>
        <SafetySection />
        <section>
          <h2>Schematic</h2>
          <ReportSchematic />
        </section>
        <OperatingPointSection />
        <BudgetSection />
        <SweepSection session={session} sheetKey={key} />
        <ToleranceSection session={session} sheetKey={key} />
        <PartsListSection />
      </ReportEditor>
    </article>
  );
}
