// The unit of co-editing: an id-addressed operation on the sheet document.
//
// The editor records immer patches, but immer writes array changes by index ("replace parts/1,
// replace parts/2, remove parts/3" for one deletion), which means nothing once someone else's
// delete has shifted the array. So a local batch is translated (diff.ts) into operations that
// name parts and wires by id; the server applies them to whatever the document is when they
// arrive, or refuses them with a reason when the element they name is gone.

/** Any JSON value an operation carries. */
export type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
export type JsonObject = { [key: string]: Json };

/** The id-keyed lists of a sheet. */
export type Collection = 'parts' | 'wires';
export const COLLECTIONS: readonly Collection[] = ['parts', 'wires'];

/** One part or wire, by id. */
export interface ElementRef {
  coll: Collection;
  id: string;
}

/** Where a `set`/`unset` lands: inside one element, or in the sheet's own fields (title, conditions…). */
export type Target = ElementRef | 'sheet';

/** Object keys below the target; never array indexes (arrays inside an element are set whole). */
export type FieldPath = readonly string[];

export type SheetOp =
  /** Add an element after the element with id `after` (null: first; an id that is gone: last). */
  | { op: 'insert'; coll: Collection; value: JsonObject; after: string | null }
  /** Remove an element. Removing a part also removes every wire on its pins. Already gone: no-op. */
  | { op: 'remove'; coll: Collection; id: string }
  /** Reorder an element (layout only); `after` as for insert. */
  | { op: 'move'; coll: Collection; id: string; after: string | null }
  /** Set one field (missing objects on the way are created). */
  | { op: 'set'; target: Target; path: FieldPath; value: Json }
  /** Delete one field (already absent: no-op). */
  | { op: 'unset'; target: Target; path: FieldPath }
  /** Replace the whole document: a REST save or a revision restore, as recorded in the log. */
  | { op: 'replaceSheet'; sheet: JsonObject };

export type SheetOpKind = SheetOp['op'];

/** The element an operation addresses, if any (for messages and for the undo resolver). */
export function opElement(op: SheetOp): ElementRef | null {
  switch (op.op) {
    case 'insert':
      return { coll: op.coll, id: typeof op.value.id === 'string' ? op.value.id : '' };
    case 'remove':
    case 'move':
      return { coll: op.coll, id: op.id };
    case 'set':
    case 'unset':
      return op.target === 'sheet' ? null : op.target;
    case 'replaceSheet':
      return null;
  }
}

/** "part R1", "wire w-3f2a…", for messages a person reads. */
export function describeElement(ref: ElementRef): string {
  return `${ref.coll === 'parts' ? 'part' : 'wire'} ${ref.id}`;
}
