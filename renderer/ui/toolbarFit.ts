// Which toolbar groups stay inline at a given toolbar width; the rest move into the overflow menu, so the toolbar
// never wraps onto a second line.

/** A group of toolbar buttons: its id, its place in the collapse order (lower goes first) and its button labels. */
export interface ToolbarGroupSize {
  readonly id: string;
  /** Groups with a lower rank move into the overflow menu first. */
  readonly collapseRank: number;
  readonly labels: readonly string[];
}

/** Estimated width of a button with this label, CSS px (12 px system font ≈ 6.8 px per character, padding, border). */
export function buttonWidthPx(label: string): number {
  return Math.ceil(18 + 6.8 * [...label].length);
}

/** Estimated width of a group: its buttons, the 4 px gaps between them and a 9 px separator. */
export function groupWidthPx(g: ToolbarGroupSize): number {
  return g.labels.reduce((s, l) => s + buttonWidthPx(l) + 4, 0) + 9;
}

/** Ids of the groups that fit inline in `availablePx` (the toolbar width minus its fixed parts); collapses by rank. */
export function inlineGroups(groups: readonly ToolbarGroupSize[], availablePx: number): Set<string> {
  const inline = new Set(groups.map((g) => g.id));
  let used = groups.reduce((s, g) => s + groupWidthPx(g), 0);
  for (const g of [...groups].sort((a, b) => a.collapseRank - b.collapseRank)) {
    if (used <= availablePx) break;
    inline.delete(g.id);
    used -= groupWidthPx(g);
  }
  return inline;
}
