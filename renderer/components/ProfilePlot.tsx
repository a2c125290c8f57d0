// Profile along x/EL: binned mean with SD band, fitted exponential, draggable fit range, residuals, boundaries,
// landmarks and a legend. Every mark is clipped to its panel; the layout follows the height the split gives it.
import { useId, useRef } from 'react';
import type { Dispatch } from 'react';
import { scaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';
import { boundaryColour, PROFILE_COLOURS, SIDE_COLOURS } from '../../core/figures';
import type { LiveMeasurement } from '../live';
import type { EditorAction } from '../state';
import { elToPx, pxToEl } from '../ui/plotLayout';
import { legendRows, profilePanels, type LegendEntry } from '../ui/profileLayout';
import { staggerLabels } from '../overlay/ImageOverlay';

/** Props of the profile plot. */
export interface ProfilePlotProps {
  readonly measurement: LiveMeasurement | null;
  readonly width: number;
  readonly height: number;
  readonly fitRangeEl: readonly [number, number];
  readonly dispatch: Dispatch<EditorAction>;
}

/** Y extent of the profile (mean ± SD, and each side's mean when the sides are measured apart), padded. */
function yDomain(m: LiveMeasurement): [number, number] {
  let lo = 0, hi = 1;
  m.profile?.mean.forEach((v, i) => {
    const s = m.profile?.sd[i] ?? 0;
    if (Number.isFinite(v)) { lo = Math.min(lo, v - s); hi = Math.max(hi, v + s); }
  });
  for (const p of m.sides ? [m.sides.dorsalProfile, m.sides.ventralProfile] : []) {
    p.mean.forEach((v) => { if (Number.isFinite(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); } });
  }
  return [lo, hi * 1.05];
}

/** Each side's bin means and its fit over the fit range (paths), when the sides are measured apart. */
function sidePaths(m: LiveMeasurement, x: (v: number) => number, y: (v: number) => number, fitRangeEl: readonly [number, number]) {
  if (!m.sides) return [];
  const s = m.sides;
  return (['dorsal', 'ventral'] as const).map((side) => {
    const p = side === 'dorsal' ? s.dorsalProfile : s.ventralProfile;
    const fit = side === 'dorsal' ? s.dorsalFit : s.ventralFit;
    const idx = Array.from(p.xEl.keys()).filter((i) => Number.isFinite(p.mean[i]));
    const mean = line<number>().x((i) => x(p.xEl[i])).y((i) => y(p.mean[i]))(idx) ?? '';
    const model = (xe: number) => (fit === null ? NaN : fit.amplitude * Math.exp(-(xe * m.eggLengthUm) / fit.lambdaUm) + fit.background);
    const [a, b] = fitRangeEl;
    const curve = fit === null ? '' : line<number>().x((t) => x(t)).y((t) => y(model(t)))(Array.from({ length: 61 }, (_, k) => a + ((b - a) * k) / 60)) ?? '';
    return { side, mean, curve, colour: SIDE_COLOURS[side] };
  });
}

/** Legend entries for what is drawn. */
function legendFor(m: LiveMeasurement, channels: readonly string[]): LegendEntry[] {
  const items: LegendEntry[] = [
    { label: `${m.profile?.channel ?? 'gradient'}: bin mean`, colour: PROFILE_COLOURS.data, shape: 'line' },
    { label: '± SD of pixels', colour: PROFILE_COLOURS.data, shape: 'band' },
  ];
  if (m.fit !== null) {
    items.push({ label: 'fit (fit range)', colour: PROFILE_COLOURS.fit, shape: 'line' });
    items.push({ label: 'fit extended', colour: PROFILE_COLOURS.fit, shape: 'dash' });
  }
  if (m.sides) {
    items.push({ label: 'dorsal side: mean, fit', colour: SIDE_COLOURS.dorsal, shape: 'dash' });
    items.push({ label: 'ventral side: mean, fit', colour: SIDE_COLOURS.ventral, shape: 'dash' });
  }
  channels.forEach((c) => items.push({ label: `${c} (scaled 0–max) and boundary`, colour: boundaryColour(c, channels), shape: 'dash' }));
  if (m.landmarks.length > 0) items.push({ label: 'landmark', colour: '#d0d4dc', shape: 'dash' });
  return items;
}

function Swatch({ e, x, y }: { e: LegendEntry; x: number; y: number }) {
  if (e.shape === 'band') return <rect x={x} y={y - 4} width={16} height={8} fill={e.colour} fillOpacity={0.3} />;
  return <line x1={x} x2={x + 16} y1={y} y2={y} stroke={e.colour} strokeWidth={2} strokeDasharray={e.shape === 'dash' ? '4 3' : undefined} />;
}

/** The profile plot. */
export function ProfilePlot({ measurement: m, width, height, fitRangeEl, dispatch }: ProfilePlotProps) {
  const drag = useRef<{ edge: 0 | 1; moved: boolean } | null>(null);
  const svg = useRef<SVGSVGElement>(null);
  const uid = useId().replace(/[^a-zA-Z0-9-]/g, '');
  if (m === null || m.profile === null || width < 100 || height < 80) return <div className="profile-empty" style={{ height }}>No profile</div>;
  const channels = m.boundaryProfiles.map((bp) => bp.channel);
  const legend = legendRows(legendFor(m, channels), elToPx(0, width), elToPx(1, width));
  const { main: MAIN, res: RES } = profilePanels(height, legend.heightPx);
  const p = m.profile, fit = m.fit;
  const x = (v: number) => elToPx(v, width);
  const y = scaleLinear().domain(yDomain(m)).range([MAIN.top + MAIN.height, MAIN.top]).nice();
  const idx = Array.from(p.xEl.keys()).filter((i) => Number.isFinite(p.mean[i]));
  const sdPath = area<number>().x((i) => x(p.xEl[i])).y0((i) => y(p.mean[i] - p.sd[i])).y1((i) => y(p.mean[i] + p.sd[i]))(idx) ?? '';
  const meanPath = line<number>().x((i) => x(p.xEl[i])).y((i) => y(p.mean[i]))(idx) ?? '';
  const model = (xe: number) => (fit === null ? NaN : fit.amplitude * Math.exp(-(xe * m.eggLengthUm) / fit.lambdaUm) + fit.background);
  const curve = (a: number, b: number) => line<number>().x((t) => x(t)).y((t) => y(model(t)))(Array.from({ length: 121 }, (_, k) => a + ((b - a) * k) / 120)) ?? '';
  const maxRes = fit === null ? 1 : Math.max(1e-12, ...Array.from(fit.residuals, Math.abs));
  const yr = scaleLinear().domain([-maxRes * 1.1, maxRes * 1.1]).range([RES.top + RES.height, RES.top]);
  const onDown = (edge: 0 | 1) => (e: React.PointerEvent) => { e.stopPropagation(); (e.target as Element).setPointerCapture(e.pointerId); drag.current = { edge, moved: false }; };
  const onMove = (e: React.PointerEvent) => {
    const d = drag.current;
    if (d === null || svg.current === null) return;
    const xe = Math.min(1, Math.max(0, pxToEl(e.clientX - svg.current.getBoundingClientRect().left, width)));
    const range: [number, number] = d.edge === 0 ? [xe, fitRangeEl[1]] : [fitRangeEl[0], xe];
    dispatch({ type: 'setFitRange', rangeEl: range, coalesce: d.moved });
    drag.current = { ...d, moved: true };
  };
  const ticks = Array.from({ length: 11 }, (_, k) => k / 10);
  const others = m.boundaryProfiles.map((bp) => {
    const vals = Array.from(bp.mean).filter(Number.isFinite);
    const lo = Math.min(...vals), hi = Math.max(...vals);
    const yMax = y.domain()[1] / 1.05;
    return line<number>().x((i) => x(bp.xEl[i])).y((i) => y(((bp.mean[i] - lo) / (hi - lo || 1)) * yMax))(Array.from(bp.xEl.keys()).filter((i) => Number.isFinite(bp.mean[i]))) ?? '';
  });
  // Boundary and landmark labels along the top of the main panel, stacked where they would overlap.
  const found = m.boundaries.filter((b) => b.positionEl !== null);
  const labels = [
    ...found.map((b) => ({ x: x(b.positionEl as number) + 3, y: MAIN.top + 11, text: `${b.channel} ${b.method} ${(b.positionEl as number).toFixed(3)}`, colour: boundaryColour(b.channel, channels), kind: 'boundary' })),
    ...m.landmarks.map((l) => ({ x: x(l.xEl) + 3, y: MAIN.top + 11, text: l.name, colour: '#d0d4dc', kind: 'landmark' })),
  ];
  const right = x(1);
  // A label that would run past the right edge is written to the left of its line.
  const placed = labels.map((l) => (l.x + l.text.length * 5.6 > right ? { ...l, x: l.x - 6 - l.text.length * 5.6 } : l));
  const dys = staggerLabels(placed, 5.6, 14);
  const sides = sidePaths(m, x, y, fitRangeEl);
  const clipMain = `pp-main-${uid}`, clipRes = `pp-res-${uid}`;
  const fx0 = x(Math.max(0, fitRangeEl[0])), fx1 = x(Math.min(1, fitRangeEl[1]));
  return (
    <svg ref={svg} width={width} height={height} className="profile-plot" data-testid="profile-plot"
      onPointerMove={onMove} onPointerUp={() => { drag.current = null; }} xmlns="http://www.w3.org/2000/svg">
      <defs>
        <clipPath id={clipMain}><rect x={x(0)} y={MAIN.top} width={x(1) - x(0)} height={MAIN.height} /></clipPath>
        <clipPath id={clipRes}><rect x={x(0)} y={RES.top} width={x(1) - x(0)} height={RES.height} /></clipPath>
      </defs>
      <g className="plot-legend" data-testid="profile-legend">
        {legend.items.map(({ entry, x: lx, y: ly }) => (
          <g key={entry.label}><Swatch e={entry} x={lx} y={ly} /><text x={lx + 20} y={ly + 3.5} className="legend-label">{entry.label}</text></g>
        ))}
      </g>
      <rect x={fx0} y={MAIN.top} width={Math.max(0, fx1 - fx0)} height={RES.top + RES.height - MAIN.top} className="fit-shade" />
      {y.ticks(Math.max(2, Math.round(MAIN.height / 40))).map((t) => <g key={t}><line x1={x(0)} x2={x(1)} y1={y(t)} y2={y(t)} className="grid" /><text x={x(0) - 6} y={y(t) + 3} className="tick" textAnchor="end">{t}</text></g>)}
      {ticks.map((t) => <g key={t}><line x1={x(t)} x2={x(t)} y1={RES.top + RES.height} y2={RES.top + RES.height + 4} className="axis" /><text x={x(t)} y={RES.top + RES.height + 15} className="tick" textAnchor="middle">{t.toFixed(1)}</text></g>)}
      <line x1={x(0)} x2={x(1)} y1={MAIN.top + MAIN.height} y2={MAIN.top + MAIN.height} className="axis" />
      <line x1={x(0)} x2={x(0)} y1={MAIN.top} y2={MAIN.top + MAIN.height} className="axis" />
      <text x={14} y={MAIN.top + MAIN.height / 2} className="axis-title" transform={`rotate(-90 14 ${MAIN.top + MAIN.height / 2})`} textAnchor="middle">intensity − bg</text>
      <text x={(x(0) + x(1)) / 2} y={height - 3} className="axis-title" textAnchor="middle" data-testid="profile-x-title">x/EL (anterior → posterior)</text>
      <g clipPath={`url(#${clipMain})`} data-testid="profile-main-marks">
        <path d={sdPath} className="sd-band" fill={PROFILE_COLOURS.data} />
        {others.map((d, i) => <path key={i} d={d} className="other-profile" stroke={boundaryColour(channels[i], channels)} />)}
        {sides.map((sp) => <path key={`${sp.side}-mean`} d={sp.mean} className="side-line" stroke={sp.colour} fill="none" strokeWidth={1} strokeOpacity={0.8} data-testid={`side-mean-${sp.side}`} />)}
        <path d={meanPath} className="mean-line" stroke={PROFILE_COLOURS.data} />
        {sides.map((sp) => <path key={`${sp.side}-fit`} d={sp.curve} className="side-fit" stroke={sp.colour} fill="none" strokeWidth={1.5} strokeDasharray="6 3" data-testid={`side-fit-${sp.side}`} />)}
        {fit !== null && <path d={curve(0, 1)} className="fit-curve-ext" stroke={PROFILE_COLOURS.fit} data-testid="fit-curve-ext" />}
        {fit !== null && <path d={curve(fitRangeEl[0], fitRangeEl[1])} className="fit-curve" stroke={PROFILE_COLOURS.fit} data-testid="fit-curve" />}
        {found.map((b, i) => <line key={i} x1={x(b.positionEl as number)} x2={x(b.positionEl as number)} y1={MAIN.top} y2={MAIN.top + MAIN.height} className="boundary-line" stroke={boundaryColour(b.channel, channels)} />)}
        {m.landmarks.map((l, i) => <line key={i} className="plot-landmark-line" x1={x(l.xEl)} x2={x(l.xEl)} y1={MAIN.top} y2={MAIN.top + MAIN.height} />)}
        {placed.map((l, i) => <text key={i} x={l.x} y={l.y + dys[i]} className={`plot-label ${l.kind}-label`} fill={l.colour} data-testid="plot-label">{l.text}</text>)}
      </g>
      <line x1={x(0)} x2={x(1)} y1={yr(0)} y2={yr(0)} className="axis" />
      <text x={x(0) - 6} y={RES.top + 8} className="tick" textAnchor="end">resid.</text>
      <g clipPath={`url(#${clipRes})`} data-testid="profile-residual-marks">
        {fit !== null && Array.from(fit.xEl, (xe, i) => <circle key={i} cx={x(xe)} cy={yr(fit.residuals[i])} r={1.8} className="residual" fill={PROFILE_COLOURS.fit} />)}
      </g>
      {([0, 1] as const).map((edge) => (
        <g key={edge} className="fit-handle" data-testid={edge === 0 ? 'fit-lo' : 'fit-hi'} onPointerDown={onDown(edge)}
          tabIndex={0} role="slider" aria-label={`fit range ${edge === 0 ? 'start' : 'end'}, x/EL (arrow keys; Shift: 0.05)`}
          aria-valuemin={0} aria-valuemax={1} aria-valuenow={Number(fitRangeEl[edge].toFixed(3))}
          onKeyDown={(e) => {
            const d = { ArrowLeft: -1, ArrowRight: 1, ArrowDown: -1, ArrowUp: 1 }[e.key];
            if (d === undefined) return;
            e.preventDefault();
            e.stopPropagation();
            const v = Math.min(1, Math.max(0, fitRangeEl[edge] + d * (e.shiftKey ? 0.05 : 0.01)));
            dispatch({ type: 'setFitRange', rangeEl: edge === 0 ? [v, fitRangeEl[1]] : [fitRangeEl[0], v], coalesce: e.repeat });
          }}>
          <line x1={x(fitRangeEl[edge])} x2={x(fitRangeEl[edge])} y1={MAIN.top} y2={RES.top + RES.height} stroke={PROFILE_COLOURS.fit} />
          <rect x={x(fitRangeEl[edge]) - 5} y={MAIN.top} width={10} height={RES.top + RES.height - MAIN.top} />
        </g>
      ))}
    </svg>
  );
}
