// Resistive symbols, after IEC 60617 (rectangle) with the IEEE 315 zig-zag as an option.
// Drawn unrotated around the part centre; leads end exactly at the pin offsets in geometry.ts.
import type { SymbolProps } from './types';

const ZIGZAG = 'M-20 0 L-17 -7 L-11 7 L-5 -7 L1 7 L7 -7 L13 7 L17 -7 L20 0';

/** The resistive body between x = −20 and 20 (rectangle or zig-zag). */
export function ResistiveBody({ style }: Pick<SymbolProps, 'style'>) {
  return style === 'ieee' ? <path d={ZIGZAG} className="sym-line" /> : <rect x={-20} y={-8} width={40} height={16} className="sym-body" />;
}

export function Leads2() {
  return (
    <>
      <line x1={-40} y1={0} x2={-20} y2={0} className="sym-line" />
      <line x1={20} y1={0} x2={40} y2={0} className="sym-line" />
    </>
  );
}

export function ResistorSymbol({ style }: SymbolProps) {
  return (
    <>
      <Leads2 />
      <ResistiveBody style={style} />
    </>
  );
}

/** Track a–b with the wiper arrow coming down from pin w onto it. */
export function PotentiometerSymbol({ style }: SymbolProps) {
  return (
    <>
      <Leads2 />
      <ResistiveBody style={style} />
      <line x1={0} y1={-40} x2={0} y2={-14} className="sym-line" />
      <path d="M-5 -17 L0 -9 L5 -17 Z" className="sym-fill" />
    </>
  );
}

/** Thermistor: resistor with the non-linear-variation stroke (a slant with a foot) and −ϑ. */
export function NtcSymbol({ style, rotation }: SymbolProps) {
  return (
    <>
      <Leads2 />
      <ResistiveBody style={style} />
      <path d="M-22 14 L-14 14 L18 -14" className="sym-line" />
      <text x={24} y={17} className="sym-text" transform={`rotate(${-rotation} 24 17)`}>
        −ϑ
      </text>
    </>
  );
}

function InArrow({ x, y }: { x: number; y: number }) {
  // from up-left towards the body
  return (
    <g transform={`translate(${x} ${y})`}>
      <line x1={-8} y1={-10} x2={0} y2={-2} className="sym-thin" />
      <path d="M0 -2 L-5.5 -3.5 L-1.5 -7.5 Z" className="sym-fill" />
    </g>
  );
}

/** Light-dependent resistor: two arrows falling onto the body. */
export function LdrSymbol({ style }: SymbolProps) {
  return (
    <>
      <Leads2 />
      <ResistiveBody style={style} />
      <InArrow x={-6} y={-10} />
      <InArrow x={6} y={-10} />
    </>
  );
}

/** Switch: two contacts with a lever, drawn open or closed from the part's `closed` param. */
export function SwitchSymbol({ params }: SymbolProps) {
  const closed = params.closed !== false;
  return (
    <>
      <line x1={-40} y1={0} x2={-16} y2={0} className="sym-line" />
      <line x1={16} y1={0} x2={40} y2={0} className="sym-line" />
      <circle cx={-16} cy={0} r={2.5} className="sym-fill" />
      <circle cx={16} cy={0} r={2.5} className="sym-body" />
      <line x1={-16} y1={0} x2={closed ? 15 : 12} y2={closed ? -3 : -14} className="sym-line" />
    </>
  );
}

/** A load: a box on a vertical branch with the quantity it holds constant (R, I or P). */
export function LoadSymbol({ params, rotation }: SymbolProps) {
  const letter = params.mode === 'current' ? 'I' : params.mode === 'power' ? 'P' : 'R';
  return (
    <>
      <line x1={0} y1={-40} x2={0} y2={-18} className="sym-line" />
      <line x1={0} y1={18} x2={0} y2={40} className="sym-line" />
      <rect x={-11} y={-18} width={22} height={36} className="sym-body" />
      <text x={0} y={4} textAnchor="middle" className="sym-text" transform={`rotate(${-rotation} 0 0)`}>
        {letter}
      </text>
    </>
  );
}
