// Key events map to the commands listed in the help overlay.
import { describe, expect, it } from 'vitest';
import { commandFor, SHORTCUTS } from '../../../src/editor/keyboard/shortcuts';

const key = (k: string, mods: Partial<{ ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }> = {}) => ({
  key: k,
  ctrlKey: false,
  metaKey: false,
  shiftKey: false,
  altKey: false,
  ...mods,
});

describe('shortcuts', () => {
  it('map the usual editing keys', () => {
    expect(commandFor(key('z', { ctrlKey: true }))).toBe('undo');
    expect(commandFor(key('Z', { metaKey: true, shiftKey: true }))).toBe('redo');
    expect(commandFor(key('y', { ctrlKey: true }))).toBe('redo');
    expect(commandFor(key('r'))).toBe('rotateCw');
    expect(commandFor(key('R', { shiftKey: true }))).toBe('rotateCcw');
    expect(commandFor(key('?', { shiftKey: true }))).toBe('help');
    expect(commandFor(key('Delete'))).toBe('delete');
    expect(commandFor(key('ArrowLeft', { shiftKey: true }))).toBe('nudgeLeft');
    expect(commandFor(key('Tab', { shiftKey: true }))).toBe('nextPart');
    expect(commandFor(key('q'))).toBeUndefined();
  });

  it('bind no key twice', () => {
    const all = SHORTCUTS.flatMap((s) => s.keys.map((k) => k.toUpperCase()));
    expect(new Set(all).size).toBe(all.length);
  });
});
