// Connects one editor store to one sync client, without React:
//   local changes (edits, undo, redo) → id-addressed operations → the client;
//   the client's document (remote edits, refusals, reconnects) → patches → editor.applyRemote;
//   undo/redo steps → re-derived for the current document, so undoing after someone else's
//   edit undoes exactly this user's change (and only what of it still exists).
import type { Patch } from 'immer';
import type { Sheet } from '../../shared/sheet';
import { diffSheets, patchesToReach, replayStep, type JsonObject, type SheetOp, type SyncClient } from '../../shared/sync';
import { isPartType } from '../../shared/parts/specs';
import { nextPartId } from '../../shared/sheet';
import { notify } from '../editor/notices';
import type { EditorStore, HistoryResolver } from '../editor/store/editorStore';
import type { PresencePeer } from '../editor/model/scopes';
import { editorForm, layoutOf, type Positions } from './editorForm';

/** A recorded local change, in both directions, as id-addressed operations. */
interface Step {
  forward: SheetOp[];
  inverse: SheetOp[];
}

export interface EditorBinding {
  /** detach from the editor and the client */
  dispose(): void;
}

const asJson = (s: Sheet) => s as unknown as JsonObject;

/** The editor's designator rule (R1, R2…) for a part that must come back under another id. */
function freshId(parts: JsonObject[], part: JsonObject): string {
  const type = typeof part.type === 'string' && isPartType(part.type) ? part.type : 'resistor';
  return nextPartId({ parts: parts as unknown as Sheet['parts'] }, type);
}

/**
 * Bind `editor` to `client` (before or after `client.start()`). Edits made before the first
 * document arrives are sent once it does, on top of the server's current version.
 */
export function bindEditor(editor: EditorStore, client: SyncClient): EditorBinding {
  const baseline = editor.getDoc();
  let last = baseline;
  let layout: Positions = {};
  let loaded = false;
  // Undo entries hold the store's own patch objects; each maps back to the step it came from.
  const steps = new WeakMap<Patch, Step>();

  const showServerState = (doc: JsonObject) => {
    const target = editorForm(doc, layout);
    if (!target) return;
    const patches = patchesToReach(asJson(editor.getDoc()), asJson(target));
    if (patches.length) editor.applyRemote(patches, 'Changes by others');
    last = editor.getDoc();
  };

  const offPatches = editor.subscribePatches((batch) => {
    if (batch.origin === 'remote') {
      last = editor.getDoc();
      return;
    }
    const before = last;
    const after = editor.getDoc();
    last = after;
    const ops = diffSheets(asJson(before), asJson(after));
    if (batch.origin === 'local') {
      const step: Step = { forward: ops, inverse: diffSheets(asJson(after), asJson(before)) };
      for (const p of batch.patches) steps.set(p, step);
    }
    if (loaded && ops.length) client.push(ops);
  });

  const resolver: HistoryResolver = (entry, direction, doc) => {
    const found: Step[] = [];
    for (const p of entry.patches) {
      const step = steps.get(p);
      if (!step) return null; // recorded before this binding: nothing better to offer
      if (found[found.length - 1] !== step) found.push(step);
    }
    const ops = direction === 'undo' ? found.reverse().flatMap((s) => s.inverse) : found.flatMap((s) => s.forward);
    // What others removed meanwhile stays removed; the rest of the step is undone (or redone).
    const { doc: target, renamed } = replayStep(asJson(doc), ops, freshId);
    for (const [from, to] of Object.entries(renamed)) notify(`${from} came back as ${to}: someone else has used the name ${from} since.`);
    return patchesToReach(asJson(doc), target);
  };
  editor.setHistoryResolver(resolver);

  const setReadOnly = () => {
    const ro = client.role === 'viewer' || client.status === 'closed';
    if (editor.getSession().readOnly !== ro) editor.updateSession((s) => void (s.readOnly = ro));
  };

  const offDocument = client.on('document', (doc, cause) => {
    if (cause === 'load' && !loaded) {
      loaded = true;
      layout = layoutOf(doc, baseline);
      // Parts the server has without a position get the layout this editor made, for everyone;
      // edits made while joining go on top of the server's version.
      const early = diffSheets(asJson(baseline), asJson(editor.getDoc()));
      const place: SheetOp[] = Object.entries(layout).map(([id, position]) => ({ op: 'set', target: { coll: 'parts', id }, path: ['position'], value: position }));
      if (client.role !== 'viewer') client.push([...place, ...early]);
      showServerState(client.document ?? doc);
      setReadOnly();
      return;
    }
    showServerState(doc);
  });
  const offRole = client.on('role', setReadOnly);
  const offStatus = client.on('status', setReadOnly);

  const offPeers = client.on('peers', (peers) => {
    const map: Record<string, PresencePeer> = {};
    for (const p of peers) if (p.leftAt === null) map[p.clientId] = { clientId: p.clientId, name: p.user.name ?? p.user.login, cursor: p.cursor, selection: p.selection };
    editor.store.setState({ presence: { peers: map } });
  });

  let lastSelection = editor.getSession().selection;
  const offSelection = editor.store.subscribe((s) => {
    if (s.session.selection === lastSelection) return;
    lastSelection = s.session.selection;
    client.updatePresence({ selection: { parts: [...lastSelection.parts], wires: [...lastSelection.wires] } });
  });

  if (client.document) {
    // Bound after the client loaded: treat it as the load.
    loaded = true;
    layout = layoutOf(client.document, baseline);
    showServerState(client.document);
    setReadOnly();
  }

  return {
    dispose() {
      for (const off of [offPatches, offDocument, offRole, offStatus, offPeers, offSelection]) off();
      editor.setHistoryResolver(null);
      editor.store.setState({ presence: { peers: {} } });
    },
  };
}
