import { describe, expect, it } from 'vitest';
import { fitToWindow, imageToScreen, panBy, pixelUnder, screenToImage, zoomAt, ZOOM_MAX } from './transform';
import { imagePt, screenPt } from './types';

// Source: the convention in core/model (pixel centres at integers), worked by hand.
describe('imageToScreen / screenToImage', () => {
  it('maps pixel 0 centre to half a zoom step from the offset', () => {
    const s = imageToScreen({ zoom: 2, offsetX: 10, offsetY: 20 }, imagePt(0, 0));
    expect([s.x, s.y]).toEqual([11, 21]);
  });
  it('maps the outer edge of pixel 0 (−0.5) to the offset', () => {
    const p = screenToImage({ zoom: 4, offsetX: 8, offsetY: 0 }, screenPt(8, 0));
    expect([p.x, p.y]).toEqual([-0.5, -0.5]);
  });
  it('round-trips', () => {
    const v = { zoom: 0.37, offsetX: -13.5, offsetY: 7.25 };
    const p = screenToImage(v, imageToScreen(v, imagePt(123.25, 45.5)));
    expect(p.x).toBeCloseTo(123.25, 10);
    expect(p.y).toBeCloseTo(45.5, 10);
  });
});

describe('zoomAt', () => {
  it('keeps the image point under the anchor fixed', () => {
    const v = { zoom: 1, offsetX: 0, offsetY: 0 };
    const anchor = screenPt(50.5, 30.5);
    const before = screenToImage(v, anchor);
    const z = zoomAt(v, anchor, 2);
    const after = screenToImage(z, anchor);
    expect(z.zoom).toBe(2);
    expect(after.x).toBeCloseTo(before.x, 12);
    expect(after.y).toBeCloseTo(before.y, 12);
  });
  it('clamps at the maximum zoom', () => {
    expect(zoomAt({ zoom: 60, offsetX: 0, offsetY: 0 }, screenPt(0, 0), 4).zoom).toBe(ZOOM_MAX);
  });
});

describe('panBy', () => {
  it('adds the screen delta to the offset', () => {
    expect(panBy({ zoom: 3, offsetX: 1, offsetY: 2 }, 5, -7)).toEqual({ zoom: 3, offsetX: 6, offsetY: -5 });
  });
});

describe('fitToWindow', () => {
  it('fits a 200×100 image into 400×400 at zoom 2, centred vertically', () => {
    expect(fitToWindow(200, 100, 400, 400)).toEqual({ zoom: 2, offsetX: 0, offsetY: 100 });
  });
  it('returns identity for an empty box', () => {
    expect(fitToWindow(10, 10, 0, 100)).toEqual({ zoom: 1, offsetX: 0, offsetY: 0 });
  });
});

describe('pixelUnder', () => {
  it('rounds to the nearest pixel centre and rejects points outside', () => {
    expect(pixelUnder(imagePt(2.49, 0.5), 4, 4)).toEqual({ col: 2, row: 1 });
    expect(pixelUnder(imagePt(-0.6, 0), 4, 4)).toBeNull();
    expect(pixelUnder(imagePt(3.6, 0), 4, 4)).toBeNull();
  });
});
