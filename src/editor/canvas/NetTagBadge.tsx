// The voltage of a net, tagged at one of its pins, placed beside the wire rather than on it.
import type { Side } from '../symbols/geometry';
import { formatVolts } from '../format/values';
import type { NetTag } from '../solve/solveView';

const PLACE: Record<Side, string> = {
  // horizontal pins: above the wire, outside the part; vertical pins: right of the wire
  left: '-translate-x-full -translate-y-full -mt-0.5 -ml-1',
  right: '-translate-y-full -mt-0.5 ml-1',
  top: '-translate-y-full ml-1.5 -mt-1',
  bottom: 'ml-1.5 mt-1',
};

/** Centred beside a point, for the far end of a net-label flag. */
const BESIDE: Record<Side, string> = {
  right: '-translate-y-1/2 ml-1.5',
  left: '-translate-x-full -translate-y-1/2 -ml-1.5',
  top: '-translate-x-1/2 -translate-y-full -mt-1',
  bottom: '-translate-x-1/2 mt-1',
};

export function NetTagBadge({ tag, side, x, y, hideName = false }: { tag: NetTag; side: Side; x: number; y: number; hideName?: boolean }) {
  // generated names (N3) say nothing; label names do
  const place = hideName ? BESIDE[side] : PLACE[side];
  const label = hideName || /^N\d+$/.test(tag.net) ? '' : tag.net;
  return (
    <div
      className={`pointer-events-none absolute z-10 whitespace-nowrap rounded-sm border border-tap/60 bg-panel px-1 py-px text-[11px] leading-none shadow-sm ${place}`}
      style={{ left: x, top: y }}
      data-testid={`net-tag-${tag.net}`}
      data-volts={tag.volts}
      title={`Net ${tag.net}: ${formatVolts(tag.volts)}`}
    >
      {label && <span className="mr-1 font-sans text-[10px] text-ink-muted">{label}</span>}
      <span className="num font-semibold text-tap">{formatVolts(tag.volts)}</span>
    </div>
  );
}
