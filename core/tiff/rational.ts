// Positive numbers as TIFF RATIONALs (two uint32s, TIFF 6.0 §2).

/** Greatest common divisor of two non-negative integers. */
function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return a;
}

/** [numerator, denominator] ≤ 2³²−1 closest to `value` with a power-of-ten denominator, then reduced. */
export function toRational(value: number): [number, number] {
  if (!(value > 0) || !Number.isFinite(value)) throw new Error('a resolution must be a positive finite number');
  const max = 0xffffffff;
  let best: [number, number] = [Math.min(max, Math.max(1, Math.round(value))), 1];
  for (let den = 10; den <= 1e9; den *= 10) {
    const num = Math.round(value * den);
    if (num > max) break;
    best = [num, den];
  }
  const g = gcd(best[0], best[1]) || 1;
  return [best[0] / g, best[1] / g];
}
