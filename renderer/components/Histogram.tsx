// Histogram of one channel with low/high display handles: dragged with the mouse, or focused and moved with the keys.
import { useMemo, useRef } from 'react';
import type { Plane } from '../../core/model';
import { dataRange, displayRangeAfterKey, histogramCounts } from '../view';

const W = 220, H = 56, BINS = 110;

/** Props: the plane, its display range and a callback for new ranges. */
export interface HistogramProps {
  readonly plane: Plane;
  readonly low: number;
  readonly high: number;
  readonly colour: string;
  readonly onChange: (low: number, high: number) => void;
}

/** Log-scaled histogram with low/high handles. */
export function Histogram({ plane, low, high, colour, onChange }: HistogramProps) {
  const [lo, hi] = useMemo(() => dataRange(plane), [plane]);
  const counts = useMemo(() => histogramCounts(plane, BINS, lo, hi), [plane, lo, hi]);
  const drag = useRef<'low' | 'high' | null>(null);
  const maxLog = Math.log1p(Math.max(...counts));
  const span = hi - lo || 1;
  const toX = (v: number) => ((v - lo) / span) * W;
  const toV = (x: number) => lo + (Math.min(W, Math.max(0, x)) / W) * span;
  const move = (e: React.PointerEvent<SVGSVGElement>) => {
    if (drag.current === null) return;
    const v = toV(e.clientX - e.currentTarget.getBoundingClientRect().left);
    if (drag.current === 'low') onChange(Math.min(v, high), high); else onChange(low, Math.max(v, low));
  };
  return (
    <svg width={W} height={H + 2} className="histogram" onPointerMove={move} onPointerUp={() => { drag.current = null; }}>
      {Array.from(counts, (c, b) => {
        const h = maxLog > 0 ? (Math.log1p(c) / maxLog) * H : 0;
        return <rect key={b} x={(b / BINS) * W} width={W / BINS + 0.3} y={H - h} height={h} fill={colour} opacity={0.55} />;
      })}
      <line x1={toX(low)} x2={toX(high)} y1={H} y2={0} className="hist-ramp" />
      {(['low', 'high'] as const).map((k) => (
        <g key={k} className="hist-handle" data-testid={`hist-${k}`} tabIndex={0} role="slider"
          aria-label={k === 'low' ? 'display range low (arrow keys; Shift for larger steps)' : 'display range high (arrow keys; Shift for larger steps)'}
          aria-valuemin={lo} aria-valuemax={hi} aria-valuenow={k === 'low' ? low : high}
          onPointerDown={(e) => { e.currentTarget.setPointerCapture(e.pointerId); drag.current = k; }}
          onKeyDown={(e) => {
            const next = displayRangeAfterKey(k, e.key, e.shiftKey, { low, high }, { lo, hi });
            if (next === null) return;
            e.preventDefault();
            onChange(next.low, next.high);
          }}>
          <line x1={toX(k === 'low' ? low : high)} x2={toX(k === 'low' ? low : high)} y1={0} y2={H} />
          <rect x={toX(k === 'low' ? low : high) - 4} y={0} width={8} height={H} />
        </g>
      ))}
    </svg>
  );
}
