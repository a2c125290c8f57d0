// Exact distance from a point to an ellipse. The nearest point (x0, y0) of the ellipse to (x, y) in the first quadrant
// is (a²x/(t + a²), b²y/(t + b²)) for the one root t > −b² of F(t) = (ax/(t + a²))² + (by/(t + b²))² − 1; F is
// convex and decreasing there, so Newton's method started left of the root climbs to it without overshooting.

/**
 * Signed distance (same units as the inputs) from (x, y) to the ellipse with semi-axes a ≥ b centred at the origin,
 * positive inside.
 */
export function ellipseDepth(x: number, y: number, a: number, b: number): number {
  const px = Math.abs(x);
  const py = Math.abs(y);
  const inside = (px / a) ** 2 + (py / b) ** 2 <= 1;
  const d = distanceFirstQuadrant(px, py, a, b);
  return inside ? d : -d;
}

/** Unsigned distance for px, py ≥ 0. */
function distanceFirstQuadrant(px: number, py: number, a: number, b: number): number {
  const a2 = a * a;
  const b2 = b * b;
  if (py === 0) {
    // On the major axis: inside the focal-curvature range the nearest points lie off the axis.
    if (a * px < a2 - b2) {
      const x0 = (a2 * px) / (a2 - b2);
      return Math.hypot(px - x0, b * Math.sqrt(Math.max(0, 1 - (x0 / a) ** 2)));
    }
    return Math.abs(px - a);
  }
  if (px === 0) return Math.abs(py - b); // on the minor axis the nearest point is its end (a ≥ b)
  const ax = a * px;
  const by = b * py;
  let t = -b2 + by; // F(t) ≥ 0 here: the second term alone is 1
  for (let k = 0; k < 100; k++) {
    const u = ax / (t + a2);
    const v = by / (t + b2);
    const f = u * u + v * v - 1;
    if (f <= 0) break;
    const df = -2 * ((u * u) / (t + a2) + (v * v) / (t + b2));
    const next = t - f / df;
    if (!(next > t)) break;
    t = next;
  }
  return Math.hypot(px - (a2 * px) / (t + a2), py - (b2 * py) / (t + b2));
}
