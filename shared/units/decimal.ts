/**
 * Decimal digits of a double, rounded to significant figures, without floating-point scaling:
 * dividing 0.047 by 0.001 gives 47.00000000000001, but toExponential reads the digits exactly.
 */

export interface DecimalDigits {
  /** Significant digits, no leading zeros ("47" for 4.7e3, "0" for zero). */
  readonly digits: string;
  /** Power of ten of the first digit: 4.7e3 → 3. */
  readonly exponent: number;
}

/**
 * The magnitude of `value` rounded to `significant` figures (1–17). Trailing zeros are dropped
 * when `trimZeros` is true (keeping at least one digit).
 */
export function toDecimalDigits(value: number, significant: number, trimZeros: boolean): DecimalDigits {
  if (!Number.isFinite(value)) throw new RangeError(`cannot take the digits of ${value}`);
  const sig = Math.min(17, Math.max(1, Math.round(significant)));
  if (value === 0) return { digits: '0', exponent: 0 };
  const [mant, exp] = Math.abs(value).toExponential(sig - 1).split('e');
  let digits = mant.replace('.', '');
  if (trimZeros) digits = digits.replace(/0+$/, '') || '0';
  return { digits, exponent: Number(exp) };
}

/**
 * The number expressed in units of 10^unitExponent, as integer and fraction digit strings:
 * 4.7e3 in units of 10³ is { int: "4", frac: "7" }; 0.47 in units of 1 is { int: "", frac: "47" }.
 */
export function splitAt(d: DecimalDigits, unitExponent: number): { int: string; frac: string } {
  const intLength = d.exponent - unitExponent + 1;
  if (intLength <= 0) return { int: '', frac: '0'.repeat(-intLength) + d.digits };
  if (intLength >= d.digits.length) return { int: d.digits + '0'.repeat(intLength - d.digits.length), frac: '' };
  return { int: d.digits.slice(0, intLength), frac: d.digits.slice(intLength) };
}
