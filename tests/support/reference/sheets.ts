// Small helpers to write test sheets compactly.
export type W = { from: string; to: string };
export const wire = (from: string, to: string): W => ({ from, to });

export function sheet(parts: Array<Record<string, unknown>>, wires: W[], extra: Record<string, unknown> = {}) {
  return { format: 'tapline.sheet', version: 1, ...extra, parts, wires };
}

export const part = (id: string, type: string, params: Record<string, unknown> = {}) => ({ id, type, params });
