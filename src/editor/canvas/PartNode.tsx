// A part on the canvas: its symbol, pins (connection handles), designator and value, readings
// from the live solve, warning marker and, for potentiometers, a wiper slider.
//
// A new operating point arrives on every slider step, so the node is split into pieces that each
// subscribe to their own slice of the solve: the symbol and pins render only when the part or its
// wiring changes, and a reading or a net tag renders only when its own text changes. A solve then
// touches the few text nodes whose values moved instead of every part on the sheet.
import { memo, useMemo } from 'react';
import { Handle, type NodeProps } from '@xyflow/react';
import { useEditorState, useSolveState } from '../EditorContext';
import { PartSymbol } from '../symbols/PartSymbol';
import { netLabelFlagEnd, rotatedPin, SYMBOL_GEOMETRY, type Side } from '../symbols/geometry';
import { labelSide, type LabelSide } from './labelPlacement';
import { SIDE_TO_HANDLE, type PartFlowNode } from './flowAdapter';
import { currentText, powerText, valueText } from './partLabels';
import { severityRank } from '../solve/solveView';
import { useCanvasDerived } from './CanvasDerived';
import { setText, useLiveDom } from './useLiveDom';
import type { PartResult } from '../solve/resultTypes';
import { NetTagBadge } from './NetTagBadge';
import { PotSlider } from './PotSlider';
import type { Part } from '../../../shared/sheet';
import type { SymbolStyle } from '../model/scopes';
import { partById } from '../store/partIndex';

const OPPOSITE: Record<Side, Side> = { left: 'right', right: 'left', top: 'bottom', bottom: 'top' };

const LABEL_STYLE: Record<LabelSide, string> = {
  above: 'bottom-full left-1/2 -translate-x-1/2 mb-0.5 items-center text-center',
  below: 'top-full left-1/2 -translate-x-1/2 mt-0.5 items-center text-center',
  left: 'right-full top-1/2 -translate-y-1/2 mr-1 items-end text-right',
  right: 'left-full top-1/2 -translate-y-1/2 ml-1 items-start text-left',
};

/** The voltage tag at one pin, if the solve put one there (renders when a tag comes or goes; its number is live). */
const PinTag = memo(function PinTag({ pinRef, side, x, y, onLabel }: { pinRef: string; side: Side; x: number; y: number; onLabel: boolean }) {
  const net = useSolveState((s) => s.tags[pinRef]?.net);
  if (!net) return null;
  return <NetTagBadge pinRef={pinRef} net={net} side={side} x={x} y={y} hideName={onLabel} />;
});

/** The symbol, pins, junction dots and tags: renders again only when the part or its wiring changes. */
const PartPins = memo(function PartPins({ part, w, h }: { part: Part; w: number; h: number }) {
  const { wireCounts } = useCanvasDerived();
  const rotation = part.rotation ?? 0;
  const flagEnd = part.type === 'net_label' ? netLabelFlagEnd(String((part.params as { name?: unknown }).name ?? '')) : 0;
  return Object.keys(SYMBOL_GEOMETRY[part.type].pins).map((pin) => {
    const p = rotatedPin(part.type, pin, rotation)!;
    const ref = `${part.id}.${pin}`;
    const count = wireCounts[ref] ?? 0;
    const x = p.x + w / 2;
    const y = p.y + h / 2;
    return (
      <div key={pin}>
        <Handle
          id={pin}
          type="source"
          position={SIDE_TO_HANDLE[p.side]}
          className={`tl-pin ${count ? 'is-wired' : ''}`}
          style={{ left: x, top: y }}
          data-testid={`pin-${ref}`}
          title={`${ref}`}
        />
        {count >= 2 && (
          <div className="pointer-events-none absolute h-[7px] w-[7px] -translate-x-1/2 -translate-y-1/2 rounded-full bg-wire" style={{ left: x, top: y }} />
        )}
        {part.type === 'net_label' ? (
          // on a net label the flag names the net: put the voltage past the flag's far end (the
          // pin is 40 units from the centre, the flag runs the other way for as long as the name)
          <PinTag pinRef={ref} side={OPPOSITE[p.side]} x={w / 2 - (p.x / 40) * (flagEnd + 2)} y={h / 2 - (p.y / 40) * (flagEnd + 2)} onLabel />
        ) : (
          <PinTag pinRef={ref} side={p.side} x={x} y={y} onLabel={false} />
        )}
      </div>
    );
  });
});

const Symbol = memo(function Symbol({ part, style }: { part: Part; style: SymbolStyle }) {
  return <PartSymbol type={part.type} rotation={part.rotation ?? 0} style={style} params={part.params as Record<string, unknown>} />;
});

/**
 * "1.2 mA · 14 mW" for the part, or "" (no solve yet, nothing to say). A source's "delivers …"
 * goes on a line of its own: the label stays narrow enough not to run into the next column.
 */
function readingText(part: Part, r: PartResult | undefined): string {
  const source = part.type === 'dc_voltage_source' || part.type === 'dc_current_source';
  return [currentText(part, r), powerText(part, r)].filter(Boolean).join(source ? '\n' : ' · ');
}

/** The reading line under a part's value: written live (useLiveDom), hidden while empty. */
function ReadingLine({ part }: { part: Part }) {
  // the part's own result object: the solve keeps it when its numbers did not change
  // (viewSharing.ts), so the text is formatted only when there is something new
  const line = useLiveDom<PartResult | undefined>(
    (s) => s.result?.parts[part.id],
    (el, r) => setText(el, readingText(part, r)),
  );
  return <span ref={line} className="num whitespace-pre text-[10px] text-ink/80 empty:hidden" data-testid={`part-reading-${part.id}`} />;
}

const PartLabel = memo(function PartLabel({ part }: { part: Part }) {
  const corner = useEditorState((s) => s.session.corners[part.id]);
  const { showReadings } = useCanvasDerived();
  const value = useMemo(() => valueText(part), [part]);
  return (
    <div className={`tl-label pointer-events-none absolute flex flex-col whitespace-nowrap leading-tight ${LABEL_STYLE[labelSide(part.type, part.rotation ?? 0)]}`}>
      <span className="num text-[11px] font-semibold text-ink">
        {part.id}
        {corner && <span className="ml-1 rounded-sm bg-sunken px-1 text-[9px] font-semibold uppercase text-caution">{corner}</span>}
      </span>
      <span className="num text-[11px] text-ink-muted">{value}</span>
      {showReadings && <ReadingLine part={part} />}
      {part.type === 'potentiometer' && <PotSlider part={part} />}
    </div>
  );
});

/** The worst finding's rank on this part (0 danger, 1 warning, …), or null when there is none. */
function useWorstFinding(partId: string): number | null {
  return useSolveState((s) => {
    const list = s.byPart[partId];
    return list?.length ? Math.min(...list.map((x) => severityRank(x.severity))) : null;
  });
}

const WarningMark = memo(function WarningMark({ partId }: { partId: string }) {
  const warnings = useSolveState((s) => s.byPart[partId]);
  if (!warnings?.length) return null;
  const worst = Math.min(...warnings.map((x) => severityRank(x.severity)));
  return (
    <div
      className={`absolute -right-2 -top-2 flex h-4 min-w-4 items-center justify-center rounded-full px-1 text-[10px] font-bold text-paper ${worst === 0 ? 'bg-danger' : 'bg-caution'}`}
      title={warnings.map((x) => x.message).join('\n')}
      data-testid={`part-warning-${partId}`}
      role="img"
      aria-label={`${warnings.length} finding${warnings.length > 1 ? 's' : ''} on ${partId}`}
    >
      !
    </div>
  );
});

function PartNodeView({ data, selected, width, height }: NodeProps<PartFlowNode>) {
  // the node holds only the placement; the part (with its params) comes from the document
  const part = useEditorState((s) => partById(s.doc.parts, data.partId));
  const style = useEditorState((s) => s.session.symbolStyle);
  const worst = useWorstFinding(data.partId);
  if (!part) return null; // deleted, React Flow has not caught up yet
  const w = width ?? 0;
  const h = height ?? 0;
  const tone = worst === null ? '' : worst === 0 ? 'is-danger' : 'is-warning';
  const hasLabel = part.type !== 'ground' && part.type !== 'net_label';

  return (
    <div
      className={`tl-part relative ${selected ? 'is-selected' : ''} ${tone}`}
      style={{ width: w, height: h }}
      data-testid={`part-${part.id}`}
      aria-label={`${part.id}, ${part.type.replace(/_/g, ' ')}`}
    >
      {selected && <div className="pointer-events-none absolute -inset-1 rounded-sm border border-dashed border-accent/70" />}
      <Symbol part={part} style={style} />
      <PartPins part={part} w={w} h={h} />
      {hasLabel && <PartLabel part={part} />}
      <WarningMark partId={part.id} />
    </div>
  );
}

export const PartNode = memo(PartNodeView);
