// One component that draws any part type's symbol in an SVG sized to its rotated box.
import type { ComponentType } from 'react';
import type { PartType, Rotation } from '../../../shared/sheet';
import type { SymbolStyle } from '../model/scopes';
import { SYMBOL_GEOMETRY, rotatedSize } from './geometry';
import { LdrSymbol, LoadSymbol, NtcSymbol, PotentiometerSymbol, ResistorSymbol, SwitchSymbol } from './passives';
import { CurrentSourceSymbol, GroundSymbol, NetLabelSymbol, VoltageSourceSymbol } from './sources';
import { DiodeSymbol, LedSymbol, NpnSymbol, PnpSymbol, ZenerSymbol } from './semiconductors';
import type { SymbolProps } from './types';

const SYMBOLS: Record<PartType, ComponentType<SymbolProps>> = {
  resistor: ResistorSymbol,
  potentiometer: PotentiometerSymbol,
  dc_voltage_source: VoltageSourceSymbol,
  dc_current_source: CurrentSourceSymbol,
  diode: DiodeSymbol,
  zener: ZenerSymbol,
  led: LedSymbol,
  npn: NpnSymbol,
  pnp: PnpSymbol,
  ntc: NtcSymbol,
  ldr: LdrSymbol,
  load: LoadSymbol,
  switch: SwitchSymbol,
  ground: GroundSymbol,
  net_label: NetLabelSymbol,
};

export interface PartSymbolProps {
  type: PartType;
  rotation?: Rotation;
  style: SymbolStyle;
  params?: Record<string, unknown>;
  /** CSS px per canvas unit (1 on the canvas, less in the palette) */
  scale?: number;
  className?: string;
}

/** The part's symbol; the SVG's box is the part's rotated box. */
export function PartSymbol({ type, rotation = 0, style, params = {}, scale = 1, className }: PartSymbolProps) {
  const { width, height } = rotatedSize(type, rotation);
  const Symbol = SYMBOLS[type];
  return (
    <svg
      width={width * scale}
      height={height * scale}
      viewBox={`${-width / 2} ${-height / 2} ${width} ${height}`}
      className={`tl-symbol overflow-visible ${className ?? ''}`}
      aria-hidden="true"
    >
      <g transform={rotation ? `rotate(${rotation})` : undefined}>
        <Symbol style={style} rotation={rotation} params={params} />
      </g>
    </svg>
  );
}

export { SYMBOL_GEOMETRY };
