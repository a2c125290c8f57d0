import { describe, expect, it } from 'vitest';
import { negativeLambdaHint } from './FitNumbers';

describe('negative-λ hint', () => {
  it('suggests swapping poles only for a hand axis; with the automatic axis it points at the gradient channel first', () => {
    expect(negativeLambdaHint('hand')).toMatch(/swapped \(S\)/);
    expect(negativeLambdaHint('auto')).not.toMatch(/swapped/);
    expect(negativeLambdaHint('auto')).toMatch(/gradient channel/);
  });
});
