/** Public API of shared/units: preferred values, parsing and formatting of typed values. */
export * from './eseries';
export { parseValue, type ParseOptions } from './parse-value';
export { formatEng, formatRkm, formatTolerance, formatValue, toleranceLetter } from './format';
export type { EngFormatOptions, RkmFormatOptions } from './format';
export { TOLERANCE_LETTERS } from './rkm';
export { QUANTITY_OF, normalizeInput, type ParseResult, type Unit } from './quantity';
