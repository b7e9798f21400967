// Where a part's designator, value and readings sit, and roughly how much room they take: the
// node view places them, the fit keeps them on screen.
import type { PartType, Rotation } from '../../../shared/sheet';
import { rotatedSize } from '../symbols/geometry';

export type LabelSide = 'above' | 'below' | 'left' | 'right';

/** Right of upright parts, above lying ones; a potentiometer's label goes opposite its wiper. */
export function labelSide(type: PartType, rotation: Rotation): LabelSide {
  if (type === 'potentiometer') return (['below', 'left', 'above', 'right'] as const)[rotation / 90];
  const { width, height } = rotatedSize(type, rotation);
  return width > height ? 'above' : 'right';
}

/**
 * Room the label block takes beside the part box, canvas units: as wide as a long reading line
 * ("Ic 17.75 mA · 6.15 mW", 22 characters of 10 px mono at 0.6 em; a source's "delivers 712 µW"
 * has a line of its own) and as tall as its lines (designator, value, readings; a potentiometer
 * adds its slider).
 */
export function labelRoom(type: PartType): { width: number; height: number } {
  const source = type === 'dc_voltage_source' || type === 'dc_current_source';
  return { width: 22 * 6 + 8, height: type === 'potentiometer' ? 62 : source ? 58 : 46 };
}
