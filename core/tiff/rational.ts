// Positive numbers as TIFF RATIONALs (two uint32s, TIFF 6.0 §2).

/**
 * [numerator, denominator], both ≤ 2³²−1, closest to `value`: the last continued-fraction convergent that fits
 * (so 10000/0.65 µm becomes exactly 200000/13 px per cm).
 */
export function toRational(value: number): [number, number] {
  if (!(value > 0) || !Number.isFinite(value)) throw new Error('a resolution must be a positive finite number');
  const max = 0xffffffff;
  if (value >= max) return [max, 1];
  let [h0, h1, k0, k1] = [0, 1, 1, 0]; // convergents h/k, seeded per the standard recurrence
  let x = value;
  for (let i = 0; i < 64; i++) {
    const a = Math.floor(x);
    const h2 = a * h1 + h0;
    const k2 = a * k1 + k0;
    if (h2 > max || k2 > max) break;
    [h0, h1, k0, k1] = [h1, h2, k1, k2];
    const frac = x - a;
    if (frac < 1e-12 || Math.abs(h1 / k1 - value) <= Number.EPSILON * value) break;
    x = 1 / frac;
  }
  return k1 === 0 ? [Math.max(1, Math.round(value)), 1] : [h1, k1];
}
