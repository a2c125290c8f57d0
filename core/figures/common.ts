// Options and helpers shared by the figure functions.
import { extent } from 'd3-array';
import { checkSize } from './svg';

/** Size and title of a figure (px); defaults 640 × 400. */
export interface FigureOptions {
  readonly widthPx?: number;
  readonly heightPx?: number;
  /** Title drawn above the plot ('' for none). */
  readonly title?: string;
  /** Smaller second line under the title ('' for none). */
  readonly subtitle?: string;
}

/** Resolved size and title; throws RangeError with an exact message for bad sizes. */
export function figureSize(
  options: FigureOptions, defaultTitle: string, defaultSubtitle = '',
): { widthPx: number; heightPx: number; title: string; subtitle: string } {
  const widthPx = options.widthPx ?? 640;
  const heightPx = options.heightPx ?? 400;
  checkSize(widthPx, heightPx);
  return { widthPx, heightPx, title: options.title ?? defaultTitle, subtitle: options.subtitle ?? defaultSubtitle };
}

/** Extent of the finite values, or the fallback when there are none; widened when both ends are equal. */
export function finiteExtent(values: Iterable<number>, fallback: [number, number]): [number, number] {
  const [lo, hi] = extent([...values].filter(Number.isFinite));
  if (lo === undefined || hi === undefined) return fallback;
  if (lo === hi) return [lo - (Math.abs(lo) || 1) * 0.1, hi + (Math.abs(hi) || 1) * 0.1];
  return [lo, hi];
}

/** A short id safe for XML (letters, digits, dashes) derived from text, so ids are stable and unique per content. */
export function stableId(prefix: string, text: string): string {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619);
  return `${prefix}-${(h >>> 0).toString(36)}`;
}

/** Deterministic jitter in [−1, 1] for the i-th point (golden-ratio sequence: spreads points evenly, no randomness). */
export function jitter(i: number): number {
  return ((i * 0.6180339887498949) % 1) * 2 - 1;
}
