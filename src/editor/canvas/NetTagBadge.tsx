// The voltage of a net, tagged at one of its pins, placed beside the wire rather than on it. The
// tag itself is React's; its reading is written by useLiveDom, so a new operating point updates
// the number without rendering the node.
import type { Side } from '../symbols/geometry';
import { formatVolts } from '../format/values';
import { setText, useLiveDom } from './useLiveDom';

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

/** The tag of net `net` drawn at pin `pinRef` (the solve's `tags[pinRef]`). */
export function NetTagBadge({ pinRef, net, side, x, y, hideName = false }: { pinRef: string; net: string; side: Side; x: number; y: number; hideName?: boolean }) {
  // generated names (N3) say nothing; label names do
  const place = hideName ? BESIDE[side] : PLACE[side];
  const label = hideName || /^N\d+$/.test(net) ? '' : net;
  const box = useLiveDom<number | undefined, HTMLDivElement>(
    (s) => s.tags[pinRef]?.volts,
    (el, volts) => {
      if (volts === undefined) return;
      el.dataset.volts = String(volts);
      el.title = `Net ${net}: ${formatVolts(volts)}`;
      const value = el.lastElementChild as HTMLElement | null;
      if (value) setText(value, formatVolts(volts));
    },
  );
  return (
    <div
      ref={box}
      className={`pointer-events-none absolute z-10 whitespace-nowrap rounded-sm border border-tap/60 bg-panel px-1 py-px text-[11px] leading-none shadow-sm ${place}`}
      style={{ left: x, top: y }}
      data-testid={`net-tag-${net}`}
    >
      {label && <span className="mr-1 font-sans text-[10px] text-ink-muted">{label}</span>}
      <span className="num font-semibold text-tap" />
    </div>
  );
}
