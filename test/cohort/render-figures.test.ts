import { join } from 'node:path';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { renderAll } from './render-figures';

describe('figures render to PNG', () => {
  it('every figure rasterises with sharp (written to test/artifacts/cohort for a person to look at)', async () => {
    // Source: demo data; librsvg inside sharp parses the SVG
    const paths = await renderAll(join(__dirname, '..', 'artifacts', 'cohort'));
    expect(paths.length).toBe(8);
    for (const p of paths) {
      const meta = await sharp(p).metadata();
      expect(meta.width).toBeGreaterThan(600);
      expect(meta.height).toBeGreaterThan(300);
    }
  });
});
