// The bar between the image and the profile: drag it, or focus it and use the arrow keys (Home/End for the ends).
import { useRef } from 'react';
import { SPLITTER_PX } from '../ui/splitLayout';

/** Props of the split bar. */
export interface SplitBarProps {
  /** Fraction of the view the lower pane takes. */
  readonly fraction: number;
  readonly onFraction: (f: number) => void;
  /** Height of the whole split view, CSS px (to turn a drag into a fraction). */
  readonly totalPx: number;
}

/** A horizontal separator that resizes the pane below it. */
export function SplitBar({ fraction, onFraction, totalPx }: SplitBarProps) {
  const start = useRef<{ y: number; f: number } | null>(null);
  const set = (f: number) => onFraction(Math.min(0.85, Math.max(0.15, f)));
  return (
    <div className="split-bar" role="separator" aria-orientation="horizontal" aria-label="resize image and profile"
      aria-valuemin={15} aria-valuemax={85} aria-valuenow={Math.round((1 - fraction) * 100)} tabIndex={0} data-testid="split-bar"
      style={{ height: SPLITTER_PX }} title="Drag (or focus and use ↑ ↓) to give the image or the profile more room"
      onPointerDown={(e) => { e.currentTarget.setPointerCapture(e.pointerId); start.current = { y: e.clientY, f: fraction }; }}
      onPointerMove={(e) => { const s = start.current; if (s !== null && totalPx > 0) set(s.f - (e.clientY - s.y) / totalPx); }}
      onPointerUp={() => { start.current = null; }}
      onKeyDown={(e) => {
        const step = { ArrowUp: 0.05, ArrowDown: -0.05, Home: 1, End: -1 }[e.key];
        if (step === undefined) return;
        e.preventDefault();
        e.stopPropagation();
        set(fraction + step);
      }} />
  );
}
