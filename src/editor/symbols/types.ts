import type { Rotation } from '../../../shared/sheet';
import type { SymbolStyle } from '../model/scopes';

export interface SymbolProps {
  style: SymbolStyle;
  /** the part's rotation, so text can be kept upright */
  rotation: Rotation;
  params: Record<string, unknown>;
}
