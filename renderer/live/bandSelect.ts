// Chooses which pixels of a straightened strip the profile samples: an edge band or a central strip.
import type { Plane } from '../../core/model';
import type { ProfileSettings } from '../../core/settings';

/** Selected rows [from, to] (inclusive) of one strip column, per side that is sampled. */
export interface ColumnBand { readonly top: readonly [number, number] | null; readonly bottom: readonly [number, number] | null }

/**
 * For each column of a straightened mask (row 0 = left of A→P), the rows the profile samples: with mode 'axis'
 * the rows within axisWidthUm/2 of the centre row; with mode 'edge' the rows within edgeDepthUm inward of the
 * mask's first/last row on the dorsal and/or ventral side. rowStepUm is the strip's row spacing in µm.
 */
export function bandRows(maskStrip: Plane, profile: ProfileSettings, rowStepUm: number): ColumnBand[] {
  const centre = (maskStrip.height - 1) / 2;
  const out: ColumnBand[] = [];
  const depth = Math.max(0, Math.round(profile.edgeDepthUm / rowStepUm) - 1);
  const leftIsDorsal = profile.dorsalSide === 'left';
  const useTop = profile.edgeSide === 'both' || (profile.edgeSide === 'dorsal') === leftIsDorsal;
  const useBottom = profile.edgeSide === 'both' || (profile.edgeSide === 'ventral') === leftIsDorsal;
  for (let i = 0; i < maskStrip.width; i += 1) {
    if (profile.mode === 'axis') {
      const half = profile.axisWidthUm / 2 / rowStepUm;
      out.push({ top: [Math.max(0, Math.ceil(centre - half)), Math.min(maskStrip.height - 1, Math.floor(centre + half))], bottom: null });
      continue;
    }
    let first = -1, last = -1;
    for (let j = 0; j < maskStrip.height; j += 1) {
      if (maskStrip.data[j * maskStrip.width + i] >= 0.5) { if (first < 0) first = j; last = j; }
    }
    if (first < 0) { out.push({ top: null, bottom: null }); continue; }
    out.push({
      top: useTop ? [first, Math.min(last, first + depth)] : null,
      bottom: useBottom ? [Math.max(first, last - depth), last] : null,
    });
  }
  return out;
}

/** A 0/1 selection image (same size as the strip) from per-column bands. */
export function bandSelection(width: number, height: number, bands: readonly ColumnBand[]): Uint8Array {
  const sel = new Uint8Array(width * height);
  bands.forEach((b, i) => {
    for (const range of [b.top, b.bottom]) {
      if (range === null) continue;
      for (let j = range[0]; j <= range[1]; j += 1) sel[j * width + i] = 1;
    }
  });
  return sel;
}
