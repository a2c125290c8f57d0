// Numbers for people (report text, tables, figure legends): enough digits that an interval's ends differ.
// CSV files keep full precision; these helpers are only for display. Minus is ASCII '-' so copied text stays numeric.

/** Decimals that show `halfWidth` with 2 significant digits and `value` with at least `minSig` significant digits. */
export function ciDecimals(value: number, halfWidth: number, minSig = 3): number {
  const fromValue = Number.isFinite(value) && value !== 0 ? minSig - 1 - Math.floor(Math.log10(Math.abs(value))) : 0;
  // Two significant digits of the half-width (common practice for quoting an uncertainty).
  const fromHalf = Number.isFinite(halfWidth) && halfWidth > 0 ? 1 - Math.floor(Math.log10(halfWidth)) : fromValue;
  return Math.min(12, Math.max(0, fromValue, fromHalf));
}

/** Fixed-point text with `decimals` decimals; "n/a" when not finite; '+' for positive values when `signed`; no "-0". */
export function fixed(v: number | null | undefined, decimals: number, signed = false): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return 'n/a';
  let s = v.toFixed(decimals);
  if (/^-0(\.0*)?$/.test(s)) s = s.slice(1);
  return signed && Number(s) > 0 ? `+${s}` : s;
}

/** `sig` significant digits in fixed-point notation (no exponent), trailing zeros kept: 0.2 → "0.200"; 0 → "0". */
export function sigFig(v: number | null | undefined, sig = 3, signed = false): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return 'n/a';
  if (v === 0) return '0';
  const d = sig - 1 - Math.floor(Math.log10(Math.abs(v)));
  return fixed(v, Math.min(12, Math.max(0, d)), signed);
}

/** A value with its interval, all at the interval's precision. `ci` is "[lo, hi]" (brackets) or "lo to hi" (words). */
export function valueWithCi(
  value: number, ciLow: number | null, ciHigh: number | null, opts: { signed?: boolean; style?: 'brackets' | 'words'; minSig?: number } = {},
): { value: string; ci: string; decimals: number } {
  const lo = ciLow ?? NaN;
  const hi = ciHigh ?? NaN;
  const half = Number.isFinite(lo) && Number.isFinite(hi) ? Math.abs(hi - lo) / 2 : NaN;
  if (!(half > 0)) {
    // No usable interval: 4 significant digits for the value; a zero-width interval shows as the same number twice.
    const decimals = ciDecimals(value, NaN, 4);
    const ci = Number.isFinite(lo) && Number.isFinite(hi) ? pair(fixed(lo, decimals, opts.signed), fixed(hi, decimals, opts.signed), opts.style) : 'n/a';
    return { value: fixed(value, decimals, opts.signed), ci, decimals };
  }
  const decimals = ciDecimals(Number.isFinite(value) ? value : (lo + hi) / 2, half, opts.minSig ?? 3);
  return { value: fixed(value, decimals, opts.signed), ci: pair(fixed(lo, decimals, opts.signed), fixed(hi, decimals, opts.signed), opts.style), decimals };
}

function pair(lo: string, hi: string, style: 'brackets' | 'words' = 'brackets'): string {
  return style === 'words' ? `${lo} to ${hi}` : `[${lo}, ${hi}]`;
}

/** Short plain form for exact inputs such as dosages (up to 4 significant digits, trailing zeros dropped). */
export function plainNumber(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return 'n/a';
  return String(Number(v.toPrecision(4)));
}
