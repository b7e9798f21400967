// Every keyboard shortcut of the editor, as data: the handler and the help overlay both read it.
import type { PartType } from '../../../shared/parts/specs';

export type CommandId =
  | 'undo'
  | 'redo'
  | 'copy'
  | 'cut'
  | 'paste'
  | 'duplicate'
  | 'selectAll'
  | 'delete'
  | 'rotateCw'
  | 'rotateCcw'
  | 'fit'
  | 'zoomIn'
  | 'zoomOut'
  | 'escape'
  | 'help'
  | 'save'
  | 'nudgeLeft'
  | 'nudgeRight'
  | 'nudgeUp'
  | 'nudgeDown'
  | 'nextPart'
  | 'toggleReadings';

export interface Shortcut {
  command: CommandId;
  /** keys as shown: "Ctrl+Z"; "Mod" is Ctrl (⌘ on a Mac) */
  keys: string[];
  label: string;
  group: 'Edit' | 'View' | 'Select' | 'Sheet';
}

export const SHORTCUTS: readonly Shortcut[] = [
  { command: 'undo', keys: ['Mod+Z'], label: 'Undo', group: 'Edit' },
  { command: 'redo', keys: ['Mod+Shift+Z', 'Mod+Y'], label: 'Redo', group: 'Edit' },
  { command: 'copy', keys: ['Mod+C'], label: 'Copy parts', group: 'Edit' },
  { command: 'cut', keys: ['Mod+X'], label: 'Cut parts', group: 'Edit' },
  { command: 'paste', keys: ['Mod+V'], label: 'Paste', group: 'Edit' },
  { command: 'duplicate', keys: ['Mod+D'], label: 'Duplicate', group: 'Edit' },
  { command: 'delete', keys: ['Delete', 'Backspace'], label: 'Delete selection', group: 'Edit' },
  { command: 'rotateCw', keys: ['R'], label: 'Rotate 90° clockwise', group: 'Edit' },
  { command: 'rotateCcw', keys: ['Shift+R'], label: 'Rotate 90° counter-clockwise', group: 'Edit' },
  { command: 'nudgeLeft', keys: ['ArrowLeft'], label: 'Move one grid step (Shift: five)', group: 'Edit' },
  { command: 'nudgeRight', keys: ['ArrowRight'], label: 'Move right', group: 'Edit' },
  { command: 'nudgeUp', keys: ['ArrowUp'], label: 'Move up', group: 'Edit' },
  { command: 'nudgeDown', keys: ['ArrowDown'], label: 'Move down', group: 'Edit' },
  { command: 'selectAll', keys: ['Mod+A'], label: 'Select everything', group: 'Select' },
  { command: 'nextPart', keys: ['Tab'], label: 'Select the next part (Shift: previous)', group: 'Select' },
  { command: 'escape', keys: ['Escape'], label: 'Stop placing / clear selection', group: 'Select' },
  { command: 'fit', keys: ['F'], label: 'Zoom to fit', group: 'View' },
  { command: 'zoomIn', keys: ['+', '='], label: 'Zoom in', group: 'View' },
  { command: 'zoomOut', keys: ['-'], label: 'Zoom out', group: 'View' },
  { command: 'toggleReadings', keys: ['V'], label: 'Show / hide readings on parts', group: 'View' },
  { command: 'help', keys: ['?'], label: 'This help', group: 'View' },
  { command: 'save', keys: ['Mod+S'], label: 'Save now', group: 'Sheet' },
];

/** Number keys that start placing a part (the palette shows them). */
export const PLACE_KEYS: Readonly<Partial<Record<PartType, string>>> = {
  resistor: '1',
  potentiometer: '2',
  dc_voltage_source: '3',
  ground: '4',
  net_label: '5',
  led: '6',
  diode: '7',
  zener: '8',
  npn: '9',
};

/** The key combination of a keyboard event, written like the table above ("Mod+Shift+Z"). */
export function comboOf(e: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>): string {
  const parts: string[] = [];
  if (e.ctrlKey || e.metaKey) parts.push('Mod');
  if (e.altKey) parts.push('Alt');
  const key = e.key.length === 1 ? e.key.toUpperCase() : e.key;
  // Shift is part of printable symbols like "?" and "+"; name it only for letters and named keys
  if (e.shiftKey && (/^[A-Z]$/.test(key) || key.length > 1)) parts.push('Shift');
  parts.push(key);
  return parts.join('+');
}

const BY_COMBO = new Map<string, CommandId>();
for (const s of SHORTCUTS) for (const k of s.keys) BY_COMBO.set(k.length === 1 ? k.toUpperCase() : k, s.command);

/** The command bound to an event, if any. Shift+arrows and Shift+Tab map to the same commands. */
export function commandFor(e: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>): CommandId | undefined {
  const combo = comboOf(e);
  return BY_COMBO.get(combo) ?? BY_COMBO.get(combo.replace(/^Shift\+(Arrow\w+|Tab)$/, '$1'));
}

/** Show "Mod" as the platform's key. */
export function displayKeys(keys: string, mac: boolean): string {
  return keys
    .replace('Mod', mac ? '⌘' : 'Ctrl')
    .replace('ArrowLeft', '←')
    .replace('ArrowRight', '→')
    .replace('ArrowUp', '↑')
    .replace('ArrowDown', '↓');
}
