// Dropping designed parts into the sheet, each as ONE undo step: a divider (both legs, the tap
// label, and, when asked, the wires to existing nets) or a value-finder combination.
import type { Draft } from 'immer';
import type { DividerLeg, ValueMatch } from '../../../../shared/design';
import { extractNets, GROUND_NET, type Sheet } from '../../../../shared/sheet';
import type { Editor } from '../../store/actions';
import { addPart, connectPins, setParam } from '../../store/commands';
import { freshLabelName } from '../../model/placementDefaults';
import { GRID } from '../../symbols/geometry';
import { addNetwork, freeSpot, networkOf, networkSize, type PartOptions } from './network';

export type DividerPlacement =
  /** wired to nothing: the user wires it */
  | { kind: 'free' }
  /** top leg from `top` to the tap, bottom leg from the tap to `bottom` ("0" is ground); `tap` an existing net or '' for a new label */
  | { kind: 'between'; top: string; bottom: string; tap: string };

export interface InsertResult {
  ok: boolean;
  /** new part ids */
  ids: string[];
  /** the tap's net name (its label) */
  tapNet?: string;
  message?: string;
}

/** A pin on net `name` of the draft, or null. */
function pinOnNet(d: Draft<Sheet>, name: string): string | null {
  const net = extractNets(d as Sheet).byName.get(name);
  return net?.pins[0] ?? null;
}

/** Why a placement cannot be made on `sheet`, or null. */
export function placementProblem(sheet: Sheet, p: DividerPlacement): string | null {
  if (p.kind === 'free') return null;
  const nets = extractNets(sheet).byName;
  if (!nets.has(p.top)) return `There is no net "${p.top}" for the top of the divider; pick one of the sheet’s nets.`;
  if (p.bottom !== GROUND_NET && !nets.has(p.bottom)) return `There is no net "${p.bottom}" for the bottom of the divider.`;
  if (p.tap && !nets.has(p.tap)) return `There is no net "${p.tap}" for the tap.`;
  if (p.top === p.bottom) return 'The top and the bottom of the divider are the same net: the divider would be shorted out. Choose two different nets.';
  if (p.tap && (p.tap === p.top || p.tap === p.bottom)) return 'The tap must be a different net from the divider’s two ends.';
  return null;
}

/**
 * Add a divider (top leg, bottom leg, a net label on the tap) as one undo step, and select it.
 * Resistances in ohms; tolerance a fraction; power rating in W.
 */
export function insertDivider(editor: Editor, legs: { top: DividerLeg; bottom: DividerLeg }, placement: DividerPlacement, o: PartOptions): InsertResult {
  const problem = placementProblem(editor.getDoc(), placement);
  if (problem) return { ok: false, ids: [], message: problem };
  let result: InsertResult = { ok: false, ids: [], message: 'The sheet is read-only.' };
  editor.applyLocal((d) => {
    // find the existing nets' pins first: new parts may change the generated net names (N1, N2…)
    const ends =
      placement.kind === 'between'
        ? { top: pinOnNet(d, placement.top)!, bottom: pinOnNet(d, placement.bottom), tap: placement.tap ? pinOnNet(d, placement.tap)! : null }
        : null;
    const origin = freeSpot(d as Sheet);
    const topNet = networkOf(legs.top.topology, legs.top.parts);
    const bottomNet = networkOf(legs.bottom.topology, legs.bottom.parts);
    const top = addNetwork(d, topNet, origin, o);
    const bottomOrigin = { x: origin.x, y: origin.y + networkSize(topNet).height + 4 * GRID };
    const bottom = addNetwork(d, bottomNet, bottomOrigin, o);
    connectPins(d, top.bottom, bottom.top);
    const ids = [...top.ids, ...bottom.ids];
    let tapNet: string;
    if (placement.kind === 'between' && ends?.tap) {
      tapNet = placement.tap;
      connectPins(d, top.bottom, ends.tap);
    } else {
      const label = addPart(d, 'net_label', { x: origin.x + 6 * GRID, y: bottomOrigin.y - 2 * GRID }, 0);
      tapNet = freshLabelName(d.parts.filter((p) => p.id !== label) as Sheet['parts']);
      setParam(d, label, 'name', tapNet);
      connectPins(d, `${label}.n`, top.bottom);
      ids.push(label);
    }
    if (ends) {
      let bottomPin = ends.bottom;
      connectPins(d, top.top, ends.top);
      if (!bottomPin) {
        const g = addPart(d, 'ground', { x: bottomOrigin.x + 2 * GRID, y: bottomOrigin.y + networkSize(bottomNet).height + 3 * GRID }, 0);
        ids.push(g);
        bottomPin = `${g}.g`;
      }
      connectPins(d, bottom.bottom, bottomPin);
    }
    result = { ok: true, ids, tapNet };
  }, `Insert divider ${legs.top.expression} / ${legs.bottom.expression}`);
  if (result.ok) editor.actions.select({ parts: result.ids });
  return result;
}

/** Add a value-finder combination, wired within itself, to the right of the sheet; one undo step. */
export function insertCombination(editor: Editor, match: Pick<ValueMatch, 'topology' | 'parts' | 'expression'>, o: PartOptions): InsertResult {
  let result: InsertResult = { ok: false, ids: [], message: 'The sheet is read-only.' };
  editor.applyLocal((d) => {
    const placed = addNetwork(d, networkOf(match.topology, match.parts), freeSpot(d as Sheet), o);
    result = { ok: true, ids: placed.ids };
  }, `Insert ${match.expression}`);
  if (result.ok) editor.actions.select({ parts: result.ids });
  return result;
}
