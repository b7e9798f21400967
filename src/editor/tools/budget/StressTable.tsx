// Each rated part: what it carries against its rating after derating, with a meter marked at 50 %.
import type { StressEntry } from '../../../../shared/analysis/budgets';
import { fmtPct, fmtQ } from '../format';

export function StressTable({ stress }: { stress: readonly StressEntry[] }) {
  if (!stress.length) return <p className="text-xs text-ink-muted">No part on this sheet has a power or current rating to check.</p>;
  const rows = [...stress].sort((a, b) => b.utilisation - a.utilisation);
  return (
    <table className="tl-table num" data-testid="stress-table">
      <thead>
        <tr><th>part</th><th className="r">carries</th><th className="r">rating</th><th>use</th></tr>
      </thead>
      <tbody>
        {rows.map((s) => {
          const u = s.quantity === 'power' ? 'W' : 'A';
          return (
            <tr key={s.part} className={s.status === 'over' ? 'is-over' : s.status === 'caution' ? 'is-caution' : ''}>
              <td>{s.part}</td>
              <td className="r">{fmtQ(s.value, u, 3)}</td>
              <td className="r" title={`${fmtQ(s.rating, u, 3)} rated; ${fmtQ(s.deratedRating, u, 3)} allowed at ${s.ambientC} °C ambient`}>
                {fmtQ(s.deratedRating, u, 3)}
                {s.deratedRating < s.rating && <span className="text-ink-muted"> of {fmtQ(s.rating, u, 3)}</span>}
              </td>
              <td>
                <div className="flex items-center gap-1.5">
                  <div className={`tl-meter flex-1 ${s.status === 'over' ? 'is-over' : s.status === 'caution' ? 'is-caution' : ''}`} aria-hidden>
                    <span style={{ width: `${Math.min(100, s.utilisation * 100)}%` }} />
                  </div>
                  <span className="w-11 text-right">{fmtPct(s.utilisation, 2)}</span>
                </div>
              </td>
            </tr>
          );
        })}
      </tbody>
      <caption className="caption-bottom pt-1 text-left font-sans text-[11px] text-ink-muted">
        Rating after derating at the part’s ambient. Resistors are derated linearly from full rating at 70 °C to zero at 155 °C (IEC 60115-1 practice); the mark is at 50 %, the usual design limit.
      </caption>
    </table>
  );
}
