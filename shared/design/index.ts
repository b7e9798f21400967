/** Public API of shared/design: value finder, divider designer, parts list. */
export {
  findValue,
  searchMatches,
  combinedResistance,
  describeCombination,
  compareMatches,
  TOPOLOGIES_BY_PARTS,
  type Topology,
  type ValueMatch,
  type ValueFinderOptions,
  type ValueFinderResult,
} from './value-finder';
export {
  designDivider,
  DEFAULT_WEIGHTS,
  type DividerDesign,
  type DividerCandidate,
  type DividerLeg,
  type DividerSpec,
  type DividerBudget,
  type SupplySpec,
  type DividerLoad,
  type ScoreWeights,
  type Score,
  type ScoreComponents,
} from './divider-designer';
export {
  dividerOutput,
  outputWindow,
  theveninResistance,
  topForOutput,
  bottomForOutput,
  supplyCurrent,
  type OutputWindow,
} from './divider-model';
export { partsList, compareDesignators, type PartsListRow } from './parts-list';
export { partsListCsv, PARTS_LIST_COLUMNS } from './parts-list-csv';
