// Diodes and bipolar transistors after IEC 60617 (the triangle points the way forward current flows).

function DiodeBase({ bar }: { bar: 'plain' | 'zener' }) {
  return (
    <>
      <line x1={-40} y1={0} x2={-11} y2={0} className="sym-line" />
      <line x1={11} y1={0} x2={40} y2={0} className="sym-line" />
      <path d="M-11 -11 L-11 11 L11 0 Z" className="sym-body" />
      {bar === 'zener' ? (
        <path d="M5 -14 L11 -11 L11 11 L17 14" className="sym-line" />
      ) : (
        <line x1={11} y1={-11} x2={11} y2={11} className="sym-line" />
      )}
    </>
  );
}

export function DiodeSymbol() {
  return <DiodeBase bar="plain" />;
}

export function ZenerSymbol() {
  return <DiodeBase bar="zener" />;
}

function OutArrow({ x, y }: { x: number; y: number }) {
  return (
    <g transform={`translate(${x} ${y})`}>
      <line x1={0} y1={0} x2={7} y2={-7} className="sym-thin" />
      <path d="M8.5 -8.5 L2.8 -7.1 L7.1 -2.8 Z" className="sym-fill" />
    </g>
  );
}

/** LED: a diode with two arrows leaving it (emitted light). */
export function LedSymbol() {
  return (
    <>
      <DiodeBase bar="plain" />
      <OutArrow x={-1} y={-12} />
      <OutArrow x={6} y={-9} />
    </>
  );
}

/** Base on the left (pin b), collector up (c), emitter down (e), in a circle envelope. */
function BjtSymbol({ polarity }: { polarity: 'npn' | 'pnp' }) {
  // emitter leg from (-8, 8) to (20, 24); the arrow sits near its outer end (npn) or inner end pointing in (pnp)
  const arrow =
    polarity === 'npn' ? (
      <path d="M20 24 L10.3 22.8 L14.7 15.9 Z" className="sym-fill" />
    ) : (
      <path d="M-6 9.1 L3.7 10.3 L-0.7 17.2 Z" className="sym-fill" />
    );
  return (
    <>
      <circle cx={4} cy={0} r={25} className="sym-envelope" />
      <line x1={-40} y1={0} x2={-8} y2={0} className="sym-line" />
      <line x1={-8} y1={-15} x2={-8} y2={15} className="sym-bar" />
      <path d="M-8 -8 L20 -24 L20 -40" className="sym-line" />
      <path d="M-8 8 L20 24 L20 40" className="sym-line" />
      {arrow}
    </>
  );
}

export function NpnSymbol() {
  return <BjtSymbol polarity="npn" />;
}

export function PnpSymbol() {
  return <BjtSymbol polarity="pnp" />;
}
