import { describe, expect, it } from 'vitest';
import { landmarkPositions } from './landmarks';

// Demo data, worked by hand: axis (0,10)→(100,10), 0.5 µm/px.
describe('landmarkPositions', () => {
  it('projects onto the axis with x/EL, µm and signed offset (left of A→P = image up = positive)', () => {
    const axis = { anterior: { x: 0, y: 10 }, posterior: { x: 100, y: 10 }, source: 'hand' as const };
    const [p] = landmarkPositions([{ name: 'fold', point: { x: 25, y: 4 } }], axis, 0.5);
    expect(p.xEl).toBe(0.25);
    expect(p.xUm).toBe(12.5);
    expect(p.offAxisUm).toBeCloseTo(3, 12);
  });
});
