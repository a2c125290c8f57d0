// Vector overlays on the image, in screen coordinates: outline, sampled band, AP axis with handles, boundaries, landmarks.
import type { ApAxis, ImagePoint } from '../../core/model';
import { pointOnAxis } from '../../core/geometry';
import { imagePt, imageToScreen } from '../geometry';
import type { ViewTransform } from '../geometry';
import type { LiveMeasurement } from '../live';
import { fixed } from '../ui/format';
import { OVERLAY_CSS } from './overlayCss';

/** Props for the overlay. */
export interface ImageOverlayProps {
  readonly view: ViewTransform;
  readonly width: number;
  readonly height: number;
  readonly outline: readonly ImagePoint[];
  readonly axis: ApAxis | null;
  readonly measurement: LiveMeasurement | null;
  /** Outlines (image px) of the sampled region. */
  readonly bandOutlines: readonly (readonly ImagePoint[])[];
  readonly fitRangeEl: readonly [number, number];
  readonly halfWidthPx: number;
  readonly selectedLandmark: number | null;
}

/** Colours for boundary channels, in order (kept apart from the yellow of the fit). */
export const BOUNDARY_COLOURS = ['#ff7ad9', '#7fd8ff', '#ff9a6a'];

/** Colour of a boundary: by its channel's place among the boundary channels, so methods of one channel match. */
export function boundaryColour(channel: string, channels: readonly string[]): string {
  return BOUNDARY_COLOURS[Math.max(0, channels.indexOf(channel)) % BOUNDARY_COLOURS.length];
}

/** Label offsets (px, downwards) so labels that would overlap are stacked; boxes are estimated from text length. */
export function staggerLabels(items: readonly { x: number; y: number; text: string }[], charPx = 6.2, lineWidthPx = 14): number[] {
  const placed: { x0: number; x1: number; y: number }[] = [];
  return items.map((it) => {
    let dy = 0;
    const x0 = it.x, x1 = it.x + it.text.length * charPx;
    while (placed.some((p) => p.x0 < x1 && x0 < p.x1 && Math.abs(p.y - (it.y + dy)) < lineWidthPx)) dy += lineWidthPx;
    placed.push({ x0, x1, y: it.y + dy });
    return dy;
  });
}

const toS = (v: ViewTransform, p: ImagePoint) => imageToScreen(v, imagePt(p.x, p.y));
const pts = (v: ViewTransform, ps: readonly ImagePoint[]) => ps.map((p) => { const s = toS(v, p); return `${s.x.toFixed(1)},${s.y.toFixed(1)}`; }).join(' ');

/** A line across the embryo, perpendicular to the axis at x/EL. */
function crossLine(axis: ApAxis, xEl: number, halfPx: number): [ImagePoint, ImagePoint] {
  return [pointOnAxis(axis, xEl, halfPx), pointOnAxis(axis, xEl, -halfPx)];
}

/** The axis, its fit-range segment and the labelled A/P handles. */
function AxisLayer({ view, axis, fitRangeEl }: { view: ViewTransform; axis: ApAxis; fitRangeEl: readonly [number, number] }) {
  const a = toS(view, axis.anterior), p = toS(view, axis.posterior);
  const f0 = toS(view, pointOnAxis(axis, fitRangeEl[0]));
  const f1 = toS(view, pointOnAxis(axis, fitRangeEl[1]));
  return (
    <g className="axis-layer">
      <line x1={a.x} y1={a.y} x2={p.x} y2={p.y} className="axis-line" />
      <line x1={f0.x} y1={f0.y} x2={f1.x} y2={f1.y} className="axis-fit" />
      {([['anterior', a, 'A'], ['posterior', p, 'P']] as const).map(([end, s, label]) => (
        <g key={end} data-testid={`handle-${end}`} data-x={s.x.toFixed(1)} data-y={s.y.toFixed(1)}>
          <circle cx={s.x} cy={s.y} r={8} className={`handle handle-${end}`} />
          <text x={s.x} y={s.y + 4} className="handle-label" textAnchor="middle">{label}</text>
        </g>
      ))}
    </g>
  );
}

/** All overlays. */
export function ImageOverlay(props: ImageOverlayProps) {
  const { view, width, height, outline, axis, measurement: m, bandOutlines, fitRangeEl, halfWidthPx, selectedLandmark } = props;
  return (
    <svg className="image-overlay" width={width} height={height} xmlns="http://www.w3.org/2000/svg">
      <style>{OVERLAY_CSS}</style>
      {outline.length > 2 && <polygon points={pts(view, outline)} className="outline" />}
      {bandOutlines.length > 0 && (
        // One even-odd path: the band's outer and inner contours together leave the interior unfilled.
        <path d={bandOutlines.map((poly) => `M${pts(view, poly)}Z`).join(' ')} fillRule="evenodd" className="band" data-testid="band" />
      )}
      {axis !== null && m?.boundaries.map((b, i) => {
        if (b.positionEl === null) return null;
        const [u, w] = crossLine(axis, b.positionEl, halfWidthPx).map((q) => toS(view, q));
        return <line key={i} x1={u.x} y1={u.y} x2={w.x} y2={w.y} className="boundary-line" stroke={boundaryColour(b.channel, m.boundaryProfiles.map((p) => p.channel))} />;
      })}
      {axis !== null && <AxisLayer view={view} axis={axis} fitRangeEl={fitRangeEl} />}
      {m !== null && (() => {
        const spots = m.landmarks.map((l) => { const s = toS(view, l.point); return { s, text: `${l.name} · ${fixed(l.xEl, 3)} EL` }; });
        const dys = staggerLabels(spots.map(({ s, text }) => ({ x: s.x + 10, y: s.y - 8, text })));
        return m.landmarks.map((l, i) => {
          const { s, text } = spots[i];
          return (
            <g key={i} className={`landmark${selectedLandmark === i ? ' selected' : ''}`} data-testid="landmark" data-name={l.name} data-x={s.x.toFixed(1)} data-y={s.y.toFixed(1)}>
              <path d={`M${s.x} ${s.y - 7} L${s.x + 7} ${s.y} L${s.x} ${s.y + 7} L${s.x - 7} ${s.y} Z`} />
              <text x={s.x + 10} y={s.y - 8 + dys[i]}>{text}</text>
            </g>
          );
        });
      })()}
    </svg>
  );
}
