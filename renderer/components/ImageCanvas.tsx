// The image layer: composite of the shown channels drawn with the view transform (nearest-neighbour when zoomed in).
import { useEffect, useMemo, useRef } from 'react';
import type { Plane } from '../../core/model';
import type { ViewTransform } from '../geometry';
import type { DisplayState } from '../state';
import { compositeRgba } from '../view';

/** Props: planes to show (one per channel), their display, the view, and the canvas size in CSS px. */
export interface ImageCanvasProps {
  readonly planes: readonly Plane[];
  readonly display: DisplayState;
  readonly view: ViewTransform;
  readonly width: number;
  readonly height: number;
}

/** Build an off-screen canvas holding the composite at image resolution. */
function compositeCanvas(planes: readonly Plane[], display: DisplayState): HTMLCanvasElement | null {
  const first = planes[0];
  if (first === undefined || display.channels.length === 0) return null;
  const c = document.createElement('canvas');
  c.width = first.width;
  c.height = first.height;
  const ctx = c.getContext('2d');
  if (ctx === null) return null;
  ctx.putImageData(new ImageData(compositeRgba(planes, display), first.width, first.height), 0, 0);
  return c;
}

/** Canvas showing the composite image under the view transform. */
export function ImageCanvas({ planes, display, view, width, height }: ImageCanvasProps) {
  const ref = useRef<HTMLCanvasElement>(null);
  const bitmap = useMemo(() => compositeCanvas(planes, display), [planes, display]);
  useEffect(() => {
    const canvas = ref.current;
    if (canvas === null) return;
    const dpr = window.devicePixelRatio || 1;
    canvas.width = Math.max(1, Math.round(width * dpr));
    canvas.height = Math.max(1, Math.round(height * dpr));
    const ctx = canvas.getContext('2d');
    if (ctx === null) return;
    ctx.setTransform(1, 0, 0, 1, 0, 0);
    ctx.fillStyle = '#0d0f12';
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    if (bitmap === null) return;
    // Pixel i covers screen [offset + i·zoom, offset + (i+1)·zoom], matching imageToScreen (centres at i + 0.5).
    ctx.setTransform(view.zoom * dpr, 0, 0, view.zoom * dpr, view.offsetX * dpr, view.offsetY * dpr);
    ctx.imageSmoothingEnabled = view.zoom < 1;
    ctx.drawImage(bitmap, 0, 0);
  }, [bitmap, view, width, height]);
  return <canvas ref={ref} className="image-canvas" style={{ width, height }} />;
}
