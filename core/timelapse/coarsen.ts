// Coarser x/EL bins for the time analysis: τ(x) per narrow profile bin is noisy, so neighbouring bins are averaged.

/** Profiles on coarser bins: centres in x/EL and, per frame, the mean of the finite fine-bin values in each. */
export interface CoarseProfiles {
  readonly xEl: Float64Array;
  readonly frames: Float64Array[];
}

/**
 * Groups fine bins (centres xEl) into bins of widthEl starting at x/EL 0 and averages each frame's values in them
 * (NaN where a coarse bin holds no finite value in that frame). Bins without any fine bin are left out.
 */
export function coarsenProfiles(xEl: ArrayLike<number>, frames: readonly ArrayLike<number>[], widthEl: number): CoarseProfiles {
  if (!(widthEl > 0 && Number.isFinite(widthEl))) throw new RangeError(`coarsenProfiles: widthEl must be a positive number, got ${widthEl}`);
  const groups = new Map<number, number[]>();
  for (let i = 0; i < xEl.length; i++) {
    if (!Number.isFinite(xEl[i])) continue;
    const g = Math.floor(xEl[i] / widthEl + 1e-9);
    const list = groups.get(g) ?? [];
    list.push(i);
    groups.set(g, list);
  }
  const keys = [...groups.keys()].sort((a, b) => a - b);
  const members = keys.map((k) => groups.get(k)!);
  const centre = Float64Array.from(members, (m) => m.reduce((s, i) => s + xEl[i], 0) / m.length);
  const out = frames.map((f) => Float64Array.from(members, (m) => {
    let s = 0, n = 0;
    for (const i of m) if (Number.isFinite(f[i])) { s += f[i]; n++; }
    return n > 0 ? s / n : NaN;
  }));
  return { xEl: centre, frames: out };
}
