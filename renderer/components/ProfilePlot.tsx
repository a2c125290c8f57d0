// Profile along x/EL: binned mean with SD band, fitted exponential, draggable fit range, residuals, boundaries, landmarks.
import { useRef } from 'react';
import type { Dispatch } from 'react';
import { scaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';
import type { LiveMeasurement } from '../live';
import type { EditorAction } from '../state';
import { elToPx, pxToEl } from '../ui/plotLayout';
import { boundaryColour } from './ImageOverlay';

/** Props of the profile plot. */
export interface ProfilePlotProps {
  readonly measurement: LiveMeasurement | null;
  readonly width: number;
  readonly fitRangeEl: readonly [number, number];
  readonly dispatch: Dispatch<EditorAction>;
}

const MAIN = { top: 14, height: 200 };
const RES = { top: 236, height: 56 };
/** Total height of the plot, CSS px. */
export const PROFILE_HEIGHT_PX = 322;

/** Y extent of the profile (mean ± SD), padded. */
function yDomain(m: LiveMeasurement): [number, number] {
  let lo = 0, hi = 1;
  m.profile?.mean.forEach((v, i) => {
    const s = m.profile?.sd[i] ?? 0;
    if (Number.isFinite(v)) { lo = Math.min(lo, v - s); hi = Math.max(hi, v + s); }
  });
  return [lo, hi * 1.05];
}

/** The profile plot. */
export function ProfilePlot({ measurement: m, width, fitRangeEl, dispatch }: ProfilePlotProps) {
  const drag = useRef<{ edge: 0 | 1; moved: boolean } | null>(null);
  const svg = useRef<SVGSVGElement>(null);
  if (m === null || m.profile === null || width < 100) return <div className="profile-empty" style={{ height: PROFILE_HEIGHT_PX }}>No profile</div>;
  const p = m.profile, fit = m.fit;
  const x = (v: number) => elToPx(v, width);
  const y = scaleLinear().domain(yDomain(m)).range([MAIN.top + MAIN.height, MAIN.top]).nice();
  const idx = Array.from(p.xEl.keys()).filter((i) => Number.isFinite(p.mean[i]));
  const sdPath = area<number>().x((i) => x(p.xEl[i])).y0((i) => y(p.mean[i] - p.sd[i])).y1((i) => y(p.mean[i] + p.sd[i]))(idx) ?? '';
  const meanPath = line<number>().x((i) => x(p.xEl[i])).y((i) => y(p.mean[i]))(idx) ?? '';
  const model = (xe: number) => (fit === null ? NaN : fit.amplitude * Math.exp(-(xe * m.eggLengthUm) / fit.lambdaUm) + fit.background);
  const curve = (a: number, b: number) => line<number>().x((t) => x(t)).y((t) => y(model(t)))(Array.from({ length: 121 }, (_, k) => a + ((b - a) * k) / 120)) ?? '';
  const maxRes = fit === null ? 1 : Math.max(1e-12, ...Array.from(fit.residuals, Math.abs));
  const yr = scaleLinear().domain([-maxRes, maxRes]).range([RES.top + RES.height, RES.top]);
  const onDown = (edge: 0 | 1) => (e: React.PointerEvent) => { e.stopPropagation(); (e.target as Element).setPointerCapture(e.pointerId); drag.current = { edge, moved: false }; };
  const onMove = (e: React.PointerEvent) => {
    const d = drag.current;
    if (d === null || svg.current === null) return;
    const xe = pxToEl(e.clientX - svg.current.getBoundingClientRect().left, width);
    const range: [number, number] = d.edge === 0 ? [xe, fitRangeEl[1]] : [fitRangeEl[0], xe];
    dispatch({ type: 'setFitRange', rangeEl: range, coalesce: d.moved });
    drag.current = { ...d, moved: true };
  };
  const channels = m.boundaryProfiles.map((bp) => bp.channel);
  const ticks = Array.from({ length: 11 }, (_, k) => k / 10);
  const others = m.boundaryProfiles.map((bp) => {
    const vals = Array.from(bp.mean).filter(Number.isFinite);
    const lo = Math.min(...vals), hi = Math.max(...vals);
    const yMax = y.domain()[1] / 1.05;
    return line<number>().x((i) => x(bp.xEl[i])).y((i) => y(((bp.mean[i] - lo) / (hi - lo || 1)) * yMax))(Array.from(bp.xEl.keys()).filter((i) => Number.isFinite(bp.mean[i]))) ?? '';
  });
  return (
    <svg ref={svg} width={width} height={PROFILE_HEIGHT_PX} className="profile-plot" data-testid="profile-plot"
      onPointerMove={onMove} onPointerUp={() => { drag.current = null; }} xmlns="http://www.w3.org/2000/svg">
      <rect x={x(fitRangeEl[0])} y={MAIN.top} width={x(fitRangeEl[1]) - x(fitRangeEl[0])} height={RES.top + RES.height - MAIN.top} className="fit-shade" />
      {y.ticks(5).map((t) => <g key={t}><line x1={x(0)} x2={x(1)} y1={y(t)} y2={y(t)} className="grid" /><text x={x(0) - 6} y={y(t) + 3} className="tick" textAnchor="end">{t}</text></g>)}
      {ticks.map((t) => <g key={t}><line x1={x(t)} x2={x(t)} y1={RES.top + RES.height} y2={RES.top + RES.height + 4} className="axis" /><text x={x(t)} y={RES.top + RES.height + 15} className="tick" textAnchor="middle">{t.toFixed(1)}</text></g>)}
      <line x1={x(0)} x2={x(1)} y1={MAIN.top + MAIN.height} y2={MAIN.top + MAIN.height} className="axis" />
      <line x1={x(0)} x2={x(0)} y1={MAIN.top} y2={MAIN.top + MAIN.height} className="axis" />
      <text x={14} y={MAIN.top + MAIN.height / 2} className="axis-title" transform={`rotate(-90 14 ${MAIN.top + MAIN.height / 2})`} textAnchor="middle">intensity − background</text>
      <text x={(x(0) + x(1)) / 2} y={PROFILE_HEIGHT_PX - 2} className="axis-title" textAnchor="middle">x/EL (anterior → posterior)</text>
      <path d={sdPath} className="sd-band" />
      {others.map((d, i) => <path key={i} d={d} className="other-profile" stroke={boundaryColour(m.boundaryProfiles[i].channel, channels)} />)}
      <path d={meanPath} className="mean-line" />
      {fit !== null && <path d={curve(0, 1)} className="fit-curve-ext" />}
      {fit !== null && <path d={curve(fitRangeEl[0], fitRangeEl[1])} className="fit-curve" data-testid="fit-curve" />}
      {m.boundaries.map((b, i) => b.positionEl !== null && <g key={i}><line x1={x(b.positionEl)} x2={x(b.positionEl)} y1={MAIN.top} y2={MAIN.top + MAIN.height} className="boundary-line" stroke={boundaryColour(b.channel, channels)} /><text x={x(b.positionEl) + 3} y={MAIN.top + 10 + 11 * i} className="boundary-label" fill={boundaryColour(b.channel, channels)}>{`${b.channel} ${b.method} ${b.positionEl.toFixed(3)}`}</text></g>)}
      {m.landmarks.map((l, i) => <g key={i} className="plot-landmark"><line x1={x(l.xEl)} x2={x(l.xEl)} y1={MAIN.top} y2={RES.top + RES.height} /><text x={x(l.xEl) + 3} y={MAIN.top + MAIN.height - 4}>{l.name}</text></g>)}
      <line x1={x(0)} x2={x(1)} y1={yr(0)} y2={yr(0)} className="axis" />
      <text x={x(0) - 6} y={RES.top + 8} className="tick" textAnchor="end">resid.</text>
      {fit !== null && Array.from(fit.xEl, (xe, i) => <circle key={i} cx={x(xe)} cy={yr(fit.residuals[i])} r={1.8} className="residual" />)}
      {([0, 1] as const).map((edge) => (
        <g key={edge} className="fit-handle" data-testid={edge === 0 ? 'fit-lo' : 'fit-hi'} onPointerDown={onDown(edge)}>
          <line x1={x(fitRangeEl[edge])} x2={x(fitRangeEl[edge])} y1={MAIN.top} y2={RES.top + RES.height} />
          <rect x={x(fitRangeEl[edge]) - 5} y={MAIN.top} width={10} height={RES.top + RES.height - MAIN.top} />
        </g>
      ))}
    </svg>
  );
}
