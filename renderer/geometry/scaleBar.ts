// Picks a round scale-bar length for the current zoom.

/** A "nice" bar length in µm (1, 2 or 5 × 10^k) whose on-screen length is at most maxScreenPx, with its screen length. */
export function chooseScaleBar(pixelSizeUm: number, zoom: number, maxScreenPx: number): { lengthUm: number; screenPx: number } | null {
  if (!(pixelSizeUm > 0) || !(zoom > 0) || !(maxScreenPx > 0)) return null;
  const umPerScreenPx = pixelSizeUm / zoom;
  const maxUm = maxScreenPx * umPerScreenPx;
  const exp = Math.floor(Math.log10(maxUm));
  let best = 0;
  for (const step of [1, 2, 5, 10]) {
    const candidate = step * 10 ** exp;
    if (candidate <= maxUm + 1e-9) best = candidate;
  }
  if (best === 0) return null;
  return { lengthUm: best, screenPx: best / umPerScreenPx };
}
