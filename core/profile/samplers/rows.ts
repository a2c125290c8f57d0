// Rows of a straightened view, by their signed distance from the axis row.

/**
 * 1 or 0 per row of a straightened view with `rowCount` rows centred on the axis: keep(d) decides each, d being the
 * row's distance from the centre in rows (d ≤ 0: left of A→P, row 0 farthest left).
 */
export function rowsWhere(rowCount: number, keep: (dRows: number) => boolean): Uint8Array {
  const centre = (rowCount - 1) / 2;
  const out = new Uint8Array(Math.max(0, rowCount));
  for (let r = 0; r < rowCount; r++) out[r] = keep(r - centre) ? 1 : 0;
  return out;
}
