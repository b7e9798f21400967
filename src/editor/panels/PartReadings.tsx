// The selected part's operating point: pin voltages and currents, power against its rating.
import type { Part } from '../../../shared/sheet';
import { partSpecs } from '../../../shared/parts/specs';
import { useSolveState } from '../EditorContext';
import { formatAmps, formatVolts, formatWatts } from '../format/values';

export function PartReadings({ part }: { part: Part }) {
  const r = useSolveState((s) => s.result?.parts[part.id]);
  const pins = useSolveState((s) => s.result?.pins);
  const pinNets = useSolveState((s) => s.pinNets);
  if (!r || !pins) return null;
  const rating = (part.params as { powerRating?: number }).powerRating;
  const share = rating ? r.power / rating : null;
  return (
    <section aria-label={`${part.id} readings`}>
      <h3 className="mb-1 text-[11px] font-semibold uppercase tracking-wider text-ink-muted">Operating point</h3>
      <table className="num w-full text-[12px]">
        <thead>
          <tr className="text-left text-[11px] text-ink-muted">
            <th className="font-normal">pin</th>
            <th className="font-normal">net</th>
            <th className="text-right font-normal">voltage</th>
            <th className="text-right font-normal">current in</th>
          </tr>
        </thead>
        <tbody>
          {partSpecs[part.type].pins.map((pin) => {
            const ref = `${part.id}.${pin.name}`;
            return (
              <tr key={pin.name} className="border-t border-rule/60">
                <td className="py-0.5">{pin.name}</td>
                <td className="text-ink-muted">{pinNets[ref] ?? '—'}</td>
                <td className="text-right">{pins[ref] === undefined ? '—' : formatVolts(pins[ref])}</td>
                <td className="text-right">{formatAmps(r.pinCurrents[pin.name] ?? 0)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="mt-2 text-[12px]">
        {r.power < 0 ? 'Delivers' : 'Dissipates'} <span className="num font-semibold">{formatWatts(Math.abs(r.power))}</span>
        {share !== null && (
          <span className={share > 1 ? 'text-danger' : share > 0.5 ? 'text-caution' : 'text-ink-muted'}>
            {' '}
            — <span className="num">{(share * 100).toFixed(share < 0.1 ? 1 : 0)} %</span> of its {formatWatts(rating!)} rating
          </span>
        )}
      </p>
    </section>
  );
}
