// The shown file's live measurement: the settings in force for it, its sampler prepared once per file and settings,
// the measurement per edit (the same core steps as the batch), and the sampled region's outline once a drag pauses.
import { useEffect, useMemo, useState } from 'react';
import type { LoadedStack } from '../../core/contract';
import type { ApAxis, ImagePoint } from '../../core/model';
import { straightViewHalfWidthPx } from '../../core/profile';
import { settingsInForce, type AnalysisSettings } from '../../core/settings';
import { bandOutlinesLive, measureLive, prepareLive, type LiveMeasurement, type LivePrepared } from '../live';
import { currentEdits, effectiveAxis, effectiveFitRange, type EditorState } from '../state';

/** What the views draw for the shown file. */
export interface LiveView {
  /** The settings in force for the shown file (its own dorsal side, when it has one). */
  readonly settings: AnalysisSettings;
  readonly prepared: LivePrepared | null;
  readonly axis: ApAxis | null;
  readonly fitRangeEl: readonly [number, number];
  readonly measurement: LiveMeasurement | null;
  /** Outlines (image px) of the sampled region along the axis; they follow the axis 0.1 s after it stops. */
  readonly bandOutlines: readonly (readonly ImagePoint[])[];
  /** µm per pixel of the shown stack, or null (unknown, or nothing shown). */
  readonly pixelSizeUm: number | null;
  /** Half the length of the lines drawn across the embryo (boundaries), image px. */
  readonly halfWidthPx: number;
}

/** The live measurement of `stack` with the editor's hand edits and settings. */
export function useLiveMeasurement(stack: LoadedStack | null, state: EditorState): LiveView {
  const edits = currentEdits(state);
  // The shown file's own dorsal side (project file) applies to its live measurement as it does in the batch.
  const settings = useMemo(() => settingsInForce(state.doc.settings, { fitRangeEl: null, dorsalSide: edits.dorsalSide ?? null }),
    [state.doc.settings, edits.dorsalSide]);
  const prepared = useMemo(() => (stack === null ? null : prepareLive(stack, settings)), [stack, settings]);
  const axis = stack === null ? null : effectiveAxis(state);
  const fitRangeEl = effectiveFitRange(state);
  const measurement = useMemo(() => (prepared === null || axis === null ? null : measureLive(prepared, axis, settings, edits.landmarks, fitRangeEl)),
    [prepared, axis, settings, edits.landmarks, fitRangeEl]);
  // The sampled-region outline is slow to trace on large images, so it follows the axis once a drag pauses.
  const [bandOutlines, setBandOutlines] = useState<ImagePoint[][]>([]);
  useEffect(() => {
    if (prepared === null || axis === null) { setBandOutlines([]); return; }
    const t = setTimeout(() => setBandOutlines(bandOutlinesLive(prepared, axis, settings)), 100);
    return () => clearTimeout(t);
  }, [prepared, axis, settings]);
  const pixelSizeUm = prepared === null ? null : (stack?.projected.pixelSizeUm ?? settings.pixelSizeUm);
  const halfWidthPx = stack === null ? 50 : straightViewHalfWidthPx(stack.detection.eggWidthUm, stack.projected.pixelSizeUm);
  return { settings, prepared, axis, fitRangeEl, measurement, bandOutlines, pixelSizeUm, halfWidthPx };
}
