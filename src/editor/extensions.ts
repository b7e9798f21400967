// Extension points for tools that live beside the editor (sweeps, tolerance runs, the divider
// designer, export): tabs in the right-hand panel and buttons in the toolbar's tool slot.
// Register at module load (e.g. in the tool's index.ts, imported once by the app); everything
// rendered sits inside the editor's context, so useEditor() / useSolveState() work there.
import type { ReactNode } from 'react';
import { create } from 'zustand';

export interface PanelTab {
  /** stable id, used for openPanelTab(id) and data-testid="panel-tab-<id>" */
  id: string;
  label: string;
  /** position among tabs; the built-in ones are 10 (Part), 20 (Sheet), 30 (Checks), 40 (Readings) */
  order: number;
  render(): ReactNode;
  /** a short count or mark shown on the tab (e.g. the number of findings) */
  badge?(): ReactNode;
}

export interface ToolbarTool {
  id: string;
  /** position in the toolbar's tool slot, ascending */
  order: number;
  render(): ReactNode;
}

interface Registry {
  tabs: PanelTab[];
  tools: ToolbarTool[];
}

export const useExtensionRegistry = create<Registry>(() => ({ tabs: [], tools: [] }));

function upsert<T extends { id: string; order: number }>(list: T[], item: T): T[] {
  return [...list.filter((x) => x.id !== item.id), item].sort((a, b) => a.order - b.order);
}

/** Add (or replace, by id) a right-panel tab. Returns an unregister function. */
export function registerPanelTab(tab: PanelTab): () => void {
  useExtensionRegistry.setState((s) => ({ tabs: upsert(s.tabs, tab) }));
  return () => useExtensionRegistry.setState((s) => ({ tabs: s.tabs.filter((t) => t !== tab) }));
}

/** Add (or replace, by id) a toolbar tool. Returns an unregister function. */
export function registerToolbarTool(tool: ToolbarTool): () => void {
  useExtensionRegistry.setState((s) => ({ tools: upsert(s.tools, tool) }));
  return () => useExtensionRegistry.setState((s) => ({ tools: s.tools.filter((t) => t !== tool) }));
}
