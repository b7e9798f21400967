// Undo/redo over document patches. One entry per user gesture: while a gesture is open
// (a drag, a slider pull), every change is folded into the same entry.
import type { Patch } from 'immer';

export interface UndoEntry {
  /** what the step did, for the menu and the help text: "Move 2 parts" */
  label: string;
  patches: Patch[];
  inversePatches: Patch[];
}

const LIMIT = 300;

export class UndoHistory {
  private past: UndoEntry[] = [];
  private future: UndoEntry[] = [];
  private gesture: UndoEntry | null = null;

  /** Start folding changes into one step. A gesture left open is closed first. */
  begin(label: string): void {
    this.end();
    this.gesture = { label, patches: [], inversePatches: [] };
  }

  /** Close the open gesture; it becomes one undo step if it changed anything. */
  end(): void {
    const g = this.gesture;
    this.gesture = null;
    if (g && g.patches.length) this.pushPast(g);
  }

  get inGesture(): boolean {
    return this.gesture !== null;
  }

  /** Record a local change (inside the open gesture, or as a step of its own). */
  record(label: string, patches: Patch[], inversePatches: Patch[]): void {
    if (!patches.length) return;
    this.future = [];
    if (this.gesture) {
      this.gesture.patches.push(...patches);
      // inverse patches undo the later change first
      this.gesture.inversePatches.unshift(...inversePatches);
      return;
    }
    this.pushPast({ label, patches, inversePatches });
  }

  /** Take the step to undo (the open gesture is closed first). */
  takeUndo(): UndoEntry | undefined {
    this.end();
    const e = this.past.pop();
    if (e) this.future.push(e);
    return e;
  }

  takeRedo(): UndoEntry | undefined {
    this.end();
    const e = this.future.pop();
    if (e) this.past.push(e);
    return e;
  }

  clear(): void {
    this.past = [];
    this.future = [];
    this.gesture = null;
  }

  get undoLabel(): string | undefined {
    return this.gesture?.patches.length ? this.gesture.label : this.past.at(-1)?.label;
  }

  get redoLabel(): string | undefined {
    return this.future.at(-1)?.label;
  }

  get depth(): { past: number; future: number } {
    return { past: this.past.length + (this.gesture?.patches.length ? 1 : 0), future: this.future.length };
  }

  private pushPast(e: UndoEntry): void {
    this.past.push(e);
    if (this.past.length > LIMIT) this.past.shift();
  }
}
