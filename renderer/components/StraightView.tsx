// The embryo straightened along its axis (anterior left), on the same x/EL scale as the profile plot below.
import { useEffect, useMemo, useRef } from 'react';
import type { LiveMeasurement } from '../live';
import type { DisplayState } from '../state';
import { compositeRgba } from '../view';
import { elToPx } from '../ui/plotLayout';
import { boundaryColour, staggerLabels } from '../overlay/ImageOverlay';

/** Props of the straightened view. */
export interface StraightViewProps {
  readonly measurement: LiveMeasurement | null;
  readonly display: DisplayState;
  readonly width: number;
  readonly fitRangeEl: readonly [number, number];
  /** Panel height, CSS px. */
  readonly height: number;
}

/** The straightened embryo with band, fit range, boundaries and landmarks. */
export function StraightView({ measurement: m, display, width, fitRangeEl, height: STRIP_HEIGHT_PX }: StraightViewProps) {
  const ref = useRef<HTMLCanvasElement>(null);
  const strip = m?.strips[0];
  const bitmap = useMemo(() => {
    if (m === null || strip === undefined) return null;
    const c = document.createElement('canvas');
    c.width = strip.width; c.height = strip.height;
    const rgba = compositeRgba(m.strips, display);
    // Tint the sampled pixels so the strip shows exactly where the profile comes from.
    for (let k = 0; k < m.bandStrip.data.length; k += 1) {
      if (m.bandStrip.data[k] < 0.5) continue;
      rgba[4 * k] = rgba[4 * k] * 0.75 + 95 * 0.25; rgba[4 * k + 1] = rgba[4 * k + 1] * 0.75 + 211 * 0.25; rgba[4 * k + 2] = rgba[4 * k + 2] * 0.75 + 224 * 0.25;
    }
    c.getContext('2d')?.putImageData(new ImageData(rgba, strip.width, strip.height), 0, 0);
    return c;
  }, [m, display]);
  const n = strip?.width ?? 2;
  const x0 = elToPx(-0.5 / (n - 1), width), x1 = elToPx(1 + 0.5 / (n - 1), width);
  useEffect(() => {
    const canvas = ref.current;
    if (canvas === null) return;
    const dpr = window.devicePixelRatio || 1;
    canvas.width = Math.max(1, Math.round(width * dpr)); canvas.height = Math.round(STRIP_HEIGHT_PX * dpr);
    const ctx = canvas.getContext('2d');
    if (ctx === null) return;
    ctx.fillStyle = '#0d0f12';
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    if (bitmap !== null) ctx.drawImage(bitmap, x0 * dpr, 0, (x1 - x0) * dpr, canvas.height);
  }, [bitmap, width, x0, x1, STRIP_HEIGHT_PX]);
  const landmarkDys = staggerLabels((m?.landmarks ?? []).map((l) => ({ x: elToPx(l.xEl, width) + 3, y: 12, text: l.name })), 5.6, 11);
  const squeeze = strip === undefined ? 1 : ((x1 - x0) / strip.width) / (STRIP_HEIGHT_PX / strip.height);
  return (
    <div className="straight-view" data-testid="straight-view" style={{ height: STRIP_HEIGHT_PX }}>
      <canvas ref={ref} style={{ width, height: STRIP_HEIGHT_PX }} />
      <svg width={width} height={STRIP_HEIGHT_PX} className="straight-overlay">
        {/* min/abs: a range given the wrong way round never draws a rectangle of negative width. */}
        <rect x={Math.min(elToPx(fitRangeEl[0], width), elToPx(fitRangeEl[1], width))} width={Math.abs(elToPx(fitRangeEl[1], width) - elToPx(fitRangeEl[0], width))} y={0} height={STRIP_HEIGHT_PX} className="fit-shade" />
        {m?.boundaries.map((b, i) => b.positionEl !== null &&
          <line key={i} x1={elToPx(b.positionEl, width)} x2={elToPx(b.positionEl, width)} y1={0} y2={STRIP_HEIGHT_PX} className="boundary-line" stroke={boundaryColour(b.channel, m.boundaryProfiles.map((p) => p.channel))} />)}
        {m?.landmarks.map((l, i) => (
          <g key={i} className="strip-landmark">
            <line x1={elToPx(l.xEl, width)} x2={elToPx(l.xEl, width)} y1={0} y2={STRIP_HEIGHT_PX} />
            <text x={elToPx(l.xEl, width) + 3} y={12 + landmarkDys[i]}>{l.name}</text>
          </g>
        ))}
        <text x={8} y={16} className="strip-label">A</text>
        <text x={width - 14} y={16} className="strip-label">P</text>
        {squeeze > 1.05 && <text x={8} y={STRIP_HEIGHT_PX - 6} className="strip-note">height ×{squeeze.toFixed(1)}</text>}
      </svg>
    </div>
  );
}
