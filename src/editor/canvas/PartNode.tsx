// A part on the canvas: its symbol, pins (connection handles), designator and value, readings
// from the live solve, warning marker and, for potentiometers, a wiper slider.
import { memo } from 'react';
import { Handle, type NodeProps } from '@xyflow/react';
import { useEditorState, useSolveState } from '../EditorContext';
import { PartSymbol } from '../symbols/PartSymbol';
import { rotatedPin, rotatedSize, SYMBOL_GEOMETRY, type Side } from '../symbols/geometry';
import { SIDE_TO_HANDLE, type PartFlowNode } from './flowAdapter';
import { currentText, powerText, valueText } from './partLabels';
import { severityRank } from '../solve/solveView';
import { useCanvasDerived } from './CanvasDerived';
import { NetTagBadge } from './NetTagBadge';
import { PotSlider } from './PotSlider';
import type { Part } from '../../../shared/sheet';

type LabelSide = 'above' | 'below' | 'left' | 'right';

const OPPOSITE: Record<Side, Side> = { left: 'right', right: 'left', top: 'bottom', bottom: 'top' };
const opposite = (s: Side) => OPPOSITE[s];

function labelSide(part: Part): LabelSide {
  const r = part.rotation ?? 0;
  if (part.type === 'potentiometer') return (['below', 'left', 'above', 'right'] as const)[r / 90];
  const { width, height } = rotatedSize(part.type, r);
  return width > height ? 'above' : 'right';
}

const LABEL_STYLE: Record<LabelSide, string> = {
  above: 'bottom-full left-1/2 -translate-x-1/2 mb-0.5 items-center text-center',
  below: 'top-full left-1/2 -translate-x-1/2 mt-0.5 items-center text-center',
  left: 'right-full top-1/2 -translate-y-1/2 mr-1 items-end text-right',
  right: 'left-full top-1/2 -translate-y-1/2 ml-1 items-start text-left',
};

function PartNodeView({ data, selected, width, height }: NodeProps<PartFlowNode>) {
  const { part } = data;
  const rotation = part.rotation ?? 0;
  const style = useEditorState((s) => s.session.symbolStyle);
  const corner = useEditorState((s) => s.session.corners[part.id]);
  const reading = useSolveState((s) => s.result?.parts[part.id]);
  const warnings = useSolveState((s) => s.byPart[part.id]);
  const { wireCounts, tags, showReadings } = useCanvasDerived();
  const w = width ?? 0;
  const h = height ?? 0;
  const worst = warnings?.length ? Math.min(...warnings.map((x) => severityRank(x.severity))) : null;
  const tone = worst === null ? '' : worst === 0 ? 'is-danger' : 'is-warning';
  const side = labelSide(part);
  const hasLabel = part.type !== 'ground' && part.type !== 'net_label';
  const current = showReadings ? currentText(part, reading) : null;
  const power = showReadings ? powerText(part, reading) : null;

  return (
    <div
      className={`tl-part relative ${selected ? 'is-selected' : ''} ${tone}`}
      style={{ width: w, height: h }}
      data-testid={`part-${part.id}`}
      aria-label={`${part.id}, ${part.type.replace(/_/g, ' ')}`}
    >
      {selected && <div className="pointer-events-none absolute -inset-1 rounded-sm border border-dashed border-accent/70" />}
      <PartSymbol type={part.type} rotation={rotation} style={style} params={part.params as Record<string, unknown>} />
      {Object.keys(SYMBOL_GEOMETRY[part.type].pins).map((pin) => {
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
            {tags[ref] && (part.type === 'net_label' ? (
              // on a net label the flag names the net: put the voltage past the flag's far end
              <NetTagBadge tag={tags[ref]} side={opposite(p.side)} x={w / 2 - p.x * 0.9} y={h / 2 - p.y * 0.9} hideName />
            ) : (
              <NetTagBadge tag={tags[ref]} side={p.side} x={x} y={y} />
            ))}
          </div>
        );
      })}
      {hasLabel && (
        <div className={`tl-label pointer-events-none absolute flex flex-col whitespace-nowrap leading-tight ${LABEL_STYLE[side]}`}>
          <span className="num text-[11px] font-semibold text-ink">
            {part.id}
            {corner && <span className="ml-1 rounded-sm bg-sunken px-1 text-[9px] font-semibold uppercase text-caution">{corner}</span>}
          </span>
          <span className="num text-[11px] text-ink-muted">{valueText(part)}</span>
          {(current || power) && (
            <span className="num text-[10px] text-ink/80" data-testid={`part-reading-${part.id}`}>
              {[current, power].filter(Boolean).join(' · ')}
            </span>
          )}
          {part.type === 'potentiometer' && <PotSlider part={part} />}
        </div>
      )}
      {worst !== null && (
        <div
          className={`absolute -right-2 -top-2 flex h-4 min-w-4 items-center justify-center rounded-full px-1 text-[10px] font-bold text-paper ${worst === 0 ? 'bg-danger' : 'bg-caution'}`}
          title={warnings!.map((x) => x.message).join('\n')}
          data-testid={`part-warning-${part.id}`}
          role="img"
          aria-label={`${warnings!.length} finding${warnings!.length > 1 ? 's' : ''} on ${part.id}`}
        >
          !
        </div>
      )}
    </div>
  );
}

export const PartNode = memo(PartNodeView);
