// Exact distance from a point to an ellipse (foot of the perpendicular by Newton's method on the angle).

/**
 * Signed distance (same units as the inputs) from (x, y) to the ellipse with semi-axes a ≥ b centred at the origin,
 * positive inside. Newton on f(θ) = (a² − b²) sinθ cosθ − x·a·sinθ + y·b·cosθ in the first quadrant.
 */
export function ellipseDepth(x: number, y: number, a: number, b: number): number {
  const px = Math.abs(x);
  const py = Math.abs(y);
  const inside = (px / a) ** 2 + (py / b) ** 2 <= 1;
  let t = Math.atan2(a * py, b * px);
  for (let k = 0; k < 6; k++) {
    const c = Math.cos(t);
    const s = Math.sin(t);
    const f = (a * a - b * b) * s * c - px * a * s + py * b * c;
    const df = (a * a - b * b) * (c * c - s * s) - px * a * c - py * b * s;
    if (df === 0) break;
    t = Math.min(Math.PI / 2, Math.max(0, t - f / df));
  }
  const d = Math.hypot(px - a * Math.cos(t), py - b * Math.sin(t));
  return inside ? d : -d;
}
