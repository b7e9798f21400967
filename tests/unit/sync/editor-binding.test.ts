// The editor store bound to a sync client (headless, over the in-memory server): local edits
// become id-addressed operations, remote edits reach the editor without entering its undo
// stack, and undo after a remote edit undoes only this user's change, as a valid operation.
import { describe, expect, it } from 'vitest';
import { parseSheet, type Sheet } from '../../../shared/sheet';
import { SyncClient, type JsonObject, type SheetOp } from '../../../shared/sync';
import { createEditor, type Editor } from '../../../src/editor/store/actions';
import { bindEditor } from '../../../src/collab/editorBinding';
import { MemoryServer, MemoryTransport, settle } from './memory-net';
import { divider } from './sheets';

async function deliver(ts: MemoryTransport[]) {
  for (let i = 0; i < 200; i++) {
    await settle();
    const t = ts.find((x) => x.toServer.length || x.toClient.length);
    if (!t) return;
    for (const f of t.toServer.splice(0)) f();
    await settle();
    for (const f of t.toClient.splice(0)) f();
  }
}

async function open(server: MemoryServer, user: string) {
  const transport = new MemoryTransport(server, user);
  const client = new SyncClient({ projectId: '00000000-0000-4000-8000-000000000001', transport, validate: (d) => parseSheet(d).ok, clientId: `${user}-c` });
  // The editor opened the sheet from the REST API first (defaults filled in, as SheetEditor does).
  const r = parseSheet(server.doc);
  if (!r.ok) throw new Error(r.error.message);
  const editor = createEditor(r.sheet);
  const binding = bindEditor(editor, client);
  const started = client.start();
  await deliver([transport]);
  await started;
  const sent: SheetOp[][] = [];
  const send = transport.sendOps.bind(transport);
  transport.sendOps = (req) => {
    sent.push(req.ops);
    return send(req);
  };
  return { editor, client, transport, binding, sent };
}

const ids = (e: Editor) => e.getDoc().parts.map((p) => p.id);
const part = (e: Editor | Sheet, id: string) => ('format' in e ? e : e.getDoc()).parts.find((p) => p.id === id);

describe('editor ⇄ sync client', () => {
  it('sends a local edit as an id-addressed operation and shows remote edits outside the undo stack', async () => {
    const server = new MemoryServer(divider());
    const a = await open(server, 'ada');
    const b = await open(server, 'ben');
    a.editor.actions.setParam('R2', 'resistance', 2200);
    await deliver([a.transport, b.transport]);
    expect(a.sent).toEqual([[{ op: 'set', target: { coll: 'parts', id: 'R2' }, path: ['params', 'resistance'], value: 2200 }]]);
    expect((part(b.editor, 'R2')!.params as { resistance: number }).resistance).toBe(2200);
    expect(b.editor.store.getState().history.canUndo).toBe(false);
    expect(b.editor.undo()).toBe(false);
  });

  it('undo of an added part after someone deleted an earlier part removes the right part', async () => {
    const server = new MemoryServer(divider());
    const a = await open(server, 'ada');
    const b = await open(server, 'ben');
    const added = a.editor.actions.place('resistor', { x: 400, y: 400 })!;
    await deliver([a.transport, b.transport]);
    b.editor.applyLocal((d) => {
      d.wires = d.wires.filter((w) => !w.from.startsWith('V1.') && !w.to.startsWith('V1.'));
      d.parts.splice(0, 1); // V1: every later index shifts
    }, 'Delete V1');
    await deliver([a.transport, b.transport]);
    expect(ids(a.editor)).toEqual(['R1', 'R2', 'GND', added]);
    expect(a.editor.undo()).toBe(true);
    await deliver([a.transport, b.transport]);
    expect(a.sent.at(-1)).toEqual([{ op: 'remove', coll: 'parts', id: added }]);
    for (const e of [a.editor, b.editor]) expect(ids(e)).toEqual(['R1', 'R2', 'GND']);
    expect(server.doc).toEqual(a.client.document);
  });

  it('undo restores only my change: my value edit is undone, the other person’s move stays', async () => {
    const server = new MemoryServer(divider());
    const a = await open(server, 'ada');
    const b = await open(server, 'ben');
    a.editor.actions.setParam('R1', 'resistance', 4700);
    await deliver([a.transport, b.transport]);
    b.editor.actions.moveParts({ R1: { x: 300, y: 20 } });
    await deliver([a.transport, b.transport]);
    a.editor.undo();
    await deliver([a.transport, b.transport]);
    for (const e of [a.editor, b.editor]) {
      expect(part(e, 'R1')!.position).toEqual({ x: 300, y: 20 });
      expect((part(e, 'R1')!.params as { resistance: number }).resistance).toBe(10000);
    }
    a.editor.redo();
    await deliver([a.transport, b.transport]);
    expect((part(b.editor, 'R1')!.params as { resistance: number }).resistance).toBe(4700);
  });

  it('undo of a delete puts the part and its wires back, even after remote edits shifted the lists and took its name', async () => {
    const server = new MemoryServer(divider());
    const a = await open(server, 'ada');
    const b = await open(server, 'ben');
    a.editor.actions.select({ parts: ['R2'], wires: [] });
    a.editor.actions.deleteSelection();
    await deliver([a.transport, b.transport]);
    // ben places a resistor (it is named R2 again, the name being free) and removes a wire
    expect(b.editor.actions.place('resistor', { x: 0, y: 300 })).toBe('R2');
    b.editor.applyLocal((d) => void d.wires.splice(0, 1), 'Remove a wire');
    await deliver([a.transport, b.transport]);
    a.editor.undo();
    await deliver([a.transport, b.transport]);
    const doc = server.doc as unknown as Sheet;
    // ada's resistor comes back where it was, as R3, with its own wires; ben's R2 is untouched
    expect(doc.parts.map((p) => p.id)).toEqual(['V1', 'R1', 'R3', 'GND', 'R2']);
    expect(part(doc, 'R3')!.position).toEqual({ x: 100, y: 100 });
    // (wire order carries no meaning; a wire whose neighbour is gone goes last)
    expect(doc.wires.map((w) => `${w.from}-${w.to}`).sort()).toEqual(['R1.b-R3.a', 'R3.b-GND.g', 'V1.neg-GND.g']);
    expect(parseSheet(doc).ok).toBe(true);
    expect(b.editor.getDoc()).toEqual(a.editor.getDoc());
  });

  it('undo of a move of a part someone deleted does nothing and sends nothing invalid', async () => {
    const server = new MemoryServer(divider());
    const a = await open(server, 'ada');
    const b = await open(server, 'ben');
    a.editor.actions.moveParts({ R1: { x: 500, y: 500 } });
    await deliver([a.transport, b.transport]);
    b.editor.actions.select({ parts: ['R1'], wires: [] });
    b.editor.actions.deleteSelection();
    await deliver([a.transport, b.transport]);
    const sentBefore = a.sent.length;
    expect(a.editor.undo()).toBe(true);
    await deliver([a.transport, b.transport]);
    expect(a.sent.length).toBe(sentBefore);
    expect(ids(a.editor)).toEqual(['V1', 'R2', 'GND']);
    expect(server.doc).toEqual(a.client.document);
  });

  it('a viewer’s editor is read-only; a role change to editor makes it editable', async () => {
    const server = new MemoryServer(divider());
    server.roles.set('cyd', 'viewer');
    const v = await open(server, 'cyd');
    expect(v.editor.getSession().readOnly).toBe(true);
    expect(v.editor.applyLocal((d) => void (d.title = 'x'))).toBeNull();
    v.transport.fire('role', { projectId: v.client.projectId, role: 'editor' });
    expect(v.editor.getSession().readOnly).toBe(false);
  });

  it('fills in positions for parts saved without one, once, for everyone', async () => {
    const raw = divider();
    delete (raw.parts as JsonObject[])[3].position;
    const server = new MemoryServer(raw);
    const transport = new MemoryTransport(server, 'ada');
    const client = new SyncClient({ projectId: '00000000-0000-4000-8000-000000000002', transport });
    const r = parseSheet(raw);
    if (!r.ok) throw new Error('bad');
    const laidOut = { ...r.sheet, parts: r.sheet.parts.map((p) => (p.position ? p : { ...p, position: { x: 40, y: 240 } })) };
    const editor = createEditor(laidOut);
    bindEditor(editor, client);
    const started = client.start();
    await deliver([transport]);
    await started;
    await deliver([transport]);
    expect((server.doc.parts as JsonObject[])[3].position).toEqual({ x: 40, y: 240 });
    expect(part(editor, 'GND')!.position).toEqual({ x: 40, y: 240 });
  });
});
