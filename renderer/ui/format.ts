// Number formatting for the numbers panels and tables.

/** Format with `digits` significant digits; '—' for null/NaN. */
export function fmt(v: number | null | undefined, digits = 3): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  if (v === 0) return '0';
  const abs = Math.abs(v);
  if (abs >= 1e5 || abs < 1e-3) return v.toExponential(digits - 1);
  return Number(v.toPrecision(digits)).toString();
}

/** Format with a fixed number of decimals; '—' for null/NaN. */
export function fixed(v: number | null | undefined, decimals = 2): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(decimals);
}
