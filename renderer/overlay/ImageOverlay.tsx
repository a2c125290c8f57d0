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
  /** Which overlays are drawn (all when absent). */
  readonly visible?: OverlayVisibility;
  /** Arrow keys on a focused handle or landmark move it by (dx, dy) screen px (Shift: 10 px); absent: not focusable. */
  readonly onKeyNudge?: (target: NudgeTarget, dxPx: number, dyPx: number, repeat: boolean) => void;
}

/** What the keyboard moves: a pole handle or a landmark. */
export type NudgeTarget = { readonly kind: 'handle'; readonly end: 'anterior' | 'posterior' } | { readonly kind: 'landmark'; readonly index: number };

/** Arrow key → screen step (px), Shift for 10×; null for other keys. */
export function arrowStep(key: string, shift: boolean): [number, number] | null {
  const s = shift ? 10 : 1;
  switch (key) {
    case 'ArrowLeft': return [-s, 0];
    case 'ArrowRight': return [s, 0];
    case 'ArrowUp': return [0, -s];
    case 'ArrowDown': return [0, s];
    default: return null;
  }
}

/** Keyboard props for a focusable overlay element. */
function nudgeProps(onKeyNudge: ImageOverlayProps['onKeyNudge'], target: NudgeTarget, label: string) {
  if (onKeyNudge === undefined) return {};
  return {
    tabIndex: 0, role: 'button', 'aria-label': `${label}: arrow keys move it (Shift: 10 px)`,
    onKeyDown: (e: React.KeyboardEvent) => {
      const step = arrowStep(e.key, e.shiftKey);
      if (step === null) return;
      e.preventDefault();
      e.stopPropagation();
      onKeyNudge(target, step[0], step[1], e.repeat);
    },
  };
}

/** The overlays that can be shown or hidden. */
export type OverlayName = 'outline' | 'band' | 'axis' | 'boundaries' | 'landmarks';

/** Shown (true) or hidden per overlay. */
export type OverlayVisibility = Readonly<Record<OverlayName, boolean>>;

/** Every overlay shown. */
export const ALL_OVERLAYS: OverlayVisibility = { outline: true, band: true, axis: true, boundaries: true, landmarks: true };

/** Where a label next to a point goes: right of it, or left when it would leave the image; never above its top. */
export function labelPlacement(xPx: number, yPx: number, text: string, widthPx: number, charPx = 6.2): { x: number; y: number } {
  const w = text.length * charPx;
  const x = xPx + 10 + w > widthPx - 2 ? Math.max(2, xPx - 10 - w) : xPx + 10;
  return { x, y: Math.max(12, yPx - 8) };
}

/** Boundary colours: the same as in exported figures and the report. */
export { BOUNDARY_COLOURS, boundaryColour } from '../../core/figures';
import { boundaryColour } from '../../core/figures';

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
function AxisLayer({ view, axis, fitRangeEl, onKeyNudge, outside }: { view: ViewTransform; axis: ApAxis; fitRangeEl: readonly [number, number];
  onKeyNudge?: ImageOverlayProps['onKeyNudge']; outside: readonly ('anterior' | 'posterior')[] }) {
  const a = toS(view, axis.anterior), p = toS(view, axis.posterior);
  const f0 = toS(view, pointOnAxis(axis, fitRangeEl[0]));
  const f1 = toS(view, pointOnAxis(axis, fitRangeEl[1]));
  return (
    <g className="axis-layer">
      <line x1={a.x} y1={a.y} x2={p.x} y2={p.y} className="axis-line" />
      <line x1={f0.x} y1={f0.y} x2={f1.x} y2={f1.y} className="axis-fit" />
      {([['anterior', a, 'A'], ['posterior', p, 'P']] as const).map(([end, s, label]) => (
        <g key={end} data-testid={`handle-${end}`} data-x={s.x.toFixed(1)} data-y={s.y.toFixed(1)} {...nudgeProps(onKeyNudge, { kind: 'handle', end }, `${end} pole`)}>
          {outside.includes(end) && <circle cx={s.x} cy={s.y} r={13} className="handle-outside" data-testid={`outside-${end}`}><title>{`the ${end} pole lies outside the embryo outline`}</title></circle>}
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
  const show = props.visible ?? ALL_OVERLAYS;
  return (
    <svg className="image-overlay" width={width} height={height} xmlns="http://www.w3.org/2000/svg">
      <style>{OVERLAY_CSS}</style>
      {show.outline && outline.length > 2 && <polygon points={pts(view, outline)} className="outline" />}
      {show.band && bandOutlines.length > 0 && (
        // One even-odd path: the band's outer and inner contours together leave the interior unfilled.
        <path d={bandOutlines.map((poly) => `M${pts(view, poly)}Z`).join(' ')} fillRule="evenodd" className="band" data-testid="band" />
      )}
      {show.boundaries && axis !== null && m?.boundaries.map((b, i) => {
        if (b.positionEl === null) return null;
        const [u, w] = crossLine(axis, b.positionEl, halfWidthPx).map((q) => toS(view, q));
        return <line key={i} x1={u.x} y1={u.y} x2={w.x} y2={w.y} className="boundary-line" stroke={boundaryColour(b.channel, m.boundaryProfiles.map((p) => p.channel))} />;
      })}
      {show.axis && axis !== null && <AxisLayer view={view} axis={axis} fitRangeEl={fitRangeEl} onKeyNudge={props.onKeyNudge} outside={m?.polesOutside ?? []} />}
      {show.landmarks && m !== null && (() => {
        const spots = m.landmarks.map((l) => { const s = toS(view, l.point); const text = `${l.name} · ${fixed(l.xEl, 3)} EL`; return { s, text, at: labelPlacement(s.x, s.y, text, width) }; });
        const dys = staggerLabels(spots.map(({ at, text }) => ({ x: at.x, y: at.y, text })));
        return m.landmarks.map((l, i) => {
          const { s, text, at } = spots[i];
          return (
            <g key={i} className={`landmark${selectedLandmark === i ? ' selected' : ''}`} data-testid="landmark" data-name={l.name} data-x={s.x.toFixed(1)} data-y={s.y.toFixed(1)}
              {...nudgeProps(props.onKeyNudge, { kind: 'landmark', index: i }, `landmark ${l.name}`)}>
              <path d={`M${s.x} ${s.y - 7} L${s.x + 7} ${s.y} L${s.x} ${s.y + 7} L${s.x - 7} ${s.y} Z`} />
              <text x={at.x} y={at.y + dys[i]}>{text}</text>
            </g>
          );
        });
      })()}
    </svg>
  );
}
