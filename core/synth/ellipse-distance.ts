// Exact distance from a point to an ellipse (foot of the perpendicular by Newton's method on the angle).

/**
 * Signed distance (same units as the inputs) from (x, y) to the ellipse with semi-axes a ≥ b centred at the origin,
 * positive inside. Newton on f(θ) = (a² − b²) sinθ cosθ − x·a·sinθ + y·b·cosθ in the first quadrant.
 */
export function ellipseDepth(x: number, y: number, a: number, b: number): number {
  const px = Math.abs(x);
  const py = Math.abs(y);
  const inside = (px / a) ** 2 + (py / b) ** 2 <= 1;
  // Inside, f has several roots (the farther feet are stationary too), so start from three angles and keep the nearest.
  const d = Math.min(...[Math.atan2(a * py, b * px), 0, Math.PI / 2].map((t0) => footDistance(px, py, a, b, t0)));
  return inside ? d : -d;
}

/** Distance from (px, py) to the ellipse point reached by Newton's method from angle t0. */
function footDistance(px: number, py: number, a: number, b: number, t0: number): number {
  let t = t0;
  for (let k = 0; k < 8; k++) {
    const c = Math.cos(t);
    const s = Math.sin(t);
    const f = (a * a - b * b) * s * c - px * a * s + py * b * c;
    const df = (a * a - b * b) * (c * c - s * s) - px * a * c - py * b * s;
    if (df === 0) break;
    t = Math.min(Math.PI / 2, Math.max(0, t - f / df));
  }
  return Math.hypot(px - a * Math.cos(t), py - b * Math.sin(t));
}
