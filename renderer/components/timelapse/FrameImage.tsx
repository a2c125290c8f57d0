// The image at the shown time point: every channel of the shrunk projection merged in the window's channel colours,
// with one display range per channel for the whole movie (from the last time point, when the gradient has formed),
// the AP axis (A and P marked) and the landmarks drawn over it.
import { useEffect, useMemo, useRef } from 'react';
import type { MovieView } from '../../../core/contract';
import type { ApAxis, Plane } from '../../../core/model';
import { autoDisplayRange, CHANNEL_COLOURS, compositeRgba } from '../../view';
import type { DisplayState } from '../../state';

/** Display ranges per channel from the last frame that has one (shared by every time point so change reads as change). */
export function movieDisplay(view: MovieView): DisplayState {
  const last = [...view.frames].reverse().find((f) => f !== null) ?? null;
  const channels = (last?.channels ?? []).map((data, i) => {
    const [low, high] = autoDisplayRange({ width: last!.width, height: last!.height, data });
    return { colour: CHANNEL_COLOURS[i % CHANNEL_COLOURS.length], low, high };
  });
  return { mode: 'merged', active: 0, channels };
}

/** Draw the axis and landmarks (image px ÷ scale = frame px). */
function drawMarks(ctx: CanvasRenderingContext2D, axis: ApAxis | null, landmarks: readonly { name: string; point: { x: number; y: number } }[], scale: number): void {
  const lw = Math.max(1, 1.5);
  ctx.lineWidth = lw;
  ctx.font = '10px system-ui, sans-serif';
  if (axis !== null) {
    const a = { x: axis.anterior.x / scale, y: axis.anterior.y / scale }, q = { x: axis.posterior.x / scale, y: axis.posterior.y / scale };
    ctx.strokeStyle = '#ffffff';
    ctx.beginPath(); ctx.moveTo(a.x, a.y); ctx.lineTo(q.x, q.y); ctx.stroke();
    for (const [p, label] of [[a, 'A'], [q, 'P']] as const) {
      ctx.fillStyle = '#ffffff';
      ctx.beginPath(); ctx.arc(p.x, p.y, 3, 0, 2 * Math.PI); ctx.fill();
      ctx.fillText(label, p.x + 4, p.y - 4);
    }
  }
  ctx.fillStyle = '#ffd24a';
  for (const l of landmarks) {
    const x = l.point.x / scale, y = l.point.y / scale;
    ctx.beginPath(); ctx.moveTo(x, y - 4); ctx.lineTo(x + 4, y); ctx.lineTo(x, y + 4); ctx.lineTo(x - 4, y); ctx.closePath(); ctx.fill();
    ctx.fillText(l.name, x + 6, y + 3);
  }
}

/** Paint time point k (merged channels, axis, landmarks) into a canvas of the frame's size; false without a frame. */
export function paintFrame(c: HTMLCanvasElement, view: MovieView, k: number, display: DisplayState): boolean {
  const frame = view.frames[k] ?? null;
  const ctx = frame === null ? null : c.getContext('2d');
  if (frame === null || ctx === null) return false;
  c.width = frame.width; c.height = frame.height;
  const planes: Plane[] = frame.channels.map((data) => ({ width: frame.width, height: frame.height, data }));
  ctx.putImageData(new ImageData(compositeRgba(planes, display), frame.width, frame.height), 0, 0);
  const r = view.results[k];
  drawMarks(ctx, r?.axis ?? null, (r?.landmarks ?? []).map((l) => ({ name: l.name, point: l.point })), frame.scale);
  return true;
}

/** The image panel of the time-lapse view. */
export function FrameImage({ view, k }: { view: MovieView; k: number }) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const display = useMemo(() => movieDisplay(view), [view]);
  const frame = view.frames[k] ?? null;
  useEffect(() => {
    if (canvas.current !== null) paintFrame(canvas.current, view, k, display);
  }, [view, k, display]);
  return (
    <div className="tl-cell tl-image" data-testid="movie-image" data-t={k}>
      {frame === null ? <p className="muted tl-empty">no image at this time point</p>
        : <canvas ref={canvas} role="img" aria-label={`image at time point ${view.timeIndices[k] + 1}, all channels merged, with the AP axis`} />}
      <span className="tl-caption muted">{view.channelNames.map((c, i) => <span key={c} style={{ color: display.channels[i]?.colour }}>{c} </span>)}</span>
    </div>
  );
}
