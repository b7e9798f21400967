// The part catalogue: for every part type its pins, params (with units, defaults, rules, which are
// sweepable and which have a tolerance), designator prefix, label, and device model.
export * from './types';
export { PART_TYPES, partSpecs, isPartType, type PartType } from './specs';
import { partSpecs, type PartType } from './specs';
import type { PartSpec } from './types';

export type PartDefinition = PartSpec;

export const partCatalog: Record<PartType, PartDefinition> = partSpecs as unknown as Record<PartType, PartDefinition>;
