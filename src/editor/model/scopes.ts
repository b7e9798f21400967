// The three scopes of editor data, kept apart in the types so nothing session-local is ever
// saved or synced by accident:
//  - document: the sheet itself (parts, wires, conditions) — stored, synced, undoable;
//  - session:  this tab's view of it (selection, tool, corners, settings) — local, never stored with the sheet;
//  - presence: other people's cursors and selections — synced, never stored (filled in by the co-editing layer).
import type { Sheet } from '../../../shared/sheet';
import type { PartType } from '../../../shared/sheet';
import type { ESeriesName } from '../../../shared/units';

/** The document is exactly the sheet file format: there is no second copy for the canvas. */
export type DocumentState = Sheet;

export type ActiveTool = { kind: 'select' } | { kind: 'place'; partType: PartType };

/** A session-only what-if: evaluate the part at the low or high end of its tolerance. */
export type Corner = 'min' | 'max';

export type SymbolStyle = 'iec' | 'ieee';

export interface Selection {
  parts: string[];
  wires: string[];
}

export interface Viewport {
  x: number;
  y: number;
  zoom: number;
}

export interface SessionState {
  selection: Selection;
  tool: ActiveTool;
  /** partId → corner; a part not listed is solved at its nominal values */
  corners: Record<string, Corner>;
  symbolStyle: SymbolStyle;
  /** the series the property panel snaps to */
  snapSeries: ESeriesName;
  viewport: Viewport | null;
  /** true while the source says this user may not edit */
  readOnly: boolean;
}

/** Another person in the sheet (kept by the co-editing layer; the editor only draws it). */
export interface PresencePeer {
  clientId: string;
  name: string;
  /** canvas units */
  cursor: { x: number; y: number } | null;
  selection: Selection;
}

export interface PresenceState {
  peers: Record<string, PresencePeer>;
}

export const emptySelection = (): Selection => ({ parts: [], wires: [] });

export function initialSession(): SessionState {
  return {
    selection: emptySelection(),
    tool: { kind: 'select' },
    corners: {},
    symbolStyle: 'iec',
    snapSeries: 'E24',
    viewport: null,
    readOnly: false,
  };
}
