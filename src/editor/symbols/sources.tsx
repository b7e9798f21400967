// Sources, ground and net labels. IEC 60617 draws an ideal voltage source as a circle the
// conductor passes straight through and an ideal current source as a circle with a bar across
// the conductor; IEEE 315 marks polarity or an arrow inside the circle instead.
import type { SymbolProps } from './types';
import { netLabelFlagEnd } from './geometry';

function VerticalLeads() {
  return (
    <>
      <line x1={0} y1={-40} x2={0} y2={-16} className="sym-line" />
      <line x1={0} y1={16} x2={0} y2={40} className="sym-line" />
    </>
  );
}

function Upright({ x, y, rotation, children }: { x: number; y: number; rotation: number; children: string }) {
  return (
    <text x={x} y={y} textAnchor="middle" dominantBaseline="central" className="sym-text" transform={`rotate(${-rotation} ${x} ${y})`}>
      {children}
    </text>
  );
}

export function VoltageSourceSymbol({ style, rotation }: SymbolProps) {
  return (
    <>
      <VerticalLeads />
      <circle cx={0} cy={0} r={16} className="sym-body" />
      {style === 'ieee' ? (
        <>
          <Upright x={0} y={-7} rotation={rotation}>+</Upright>
          <Upright x={0} y={8} rotation={rotation}>−</Upright>
        </>
      ) : (
        <>
          <line x1={0} y1={-16} x2={0} y2={16} className="sym-line" />
          <Upright x={10} y={-26} rotation={rotation}>+</Upright>
        </>
      )}
    </>
  );
}

/** Current leaves at pos: the arrow points towards pin pos (up, unrotated). */
export function CurrentSourceSymbol({ style }: SymbolProps) {
  return (
    <>
      <VerticalLeads />
      <circle cx={0} cy={0} r={16} className="sym-body" />
      {style === 'ieee' ? (
        <>
          <line x1={0} y1={10} x2={0} y2={-4} className="sym-line" />
          <path d="M-5 -3 L0 -11 L5 -3 Z" className="sym-fill" />
        </>
      ) : (
        <>
          <line x1={-16} y1={0} x2={16} y2={0} className="sym-line" />
          <line x1={22} y1={10} x2={22} y2={-6} className="sym-thin" />
          <path d="M18.5 -5 L22 -12 L25.5 -5 Z" className="sym-fill" />
        </>
      )}
    </>
  );
}

export function GroundSymbol() {
  return (
    <>
      <line x1={0} y1={-20} x2={0} y2={-2} className="sym-line" />
      <line x1={-13} y1={-2} x2={13} y2={-2} className="sym-line" />
      <line x1={-8} y1={4} x2={8} y2={4} className="sym-line" />
      <line x1={-3} y1={10} x2={3} y2={10} className="sym-line" />
    </>
  );
}

/** A flag with the net's name; the text stays upright in any rotation. */
export function NetLabelSymbol({ params, rotation }: SymbolProps) {
  const name = String(params.name ?? '');
  // the flag is as long as the name (it may reach past the symbol's box); the text runs along it
  // and reads left to right or bottom to top, never upside down
  const end = netLabelFlagEnd(name);
  const mid = (-22 + end) / 2;
  return (
    <>
      <line x1={-40} y1={0} x2={-30} y2={0} className="sym-line" />
      <path d={`M-30 0 L-22 -10 L${end} -10 L${end} 10 L-22 10 Z`} className="sym-body" />
      <text
        x={mid}
        y={0}
        textAnchor="middle"
        dominantBaseline="central"
        className="sym-label"
        transform={rotation === 180 || rotation === 90 ? `rotate(180 ${mid} 0)` : undefined}
      >
        {name}
      </text>
    </>
  );
}
