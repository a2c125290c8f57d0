// Loads the shown file through the API whenever it or a setting that changes loading changes.
import { useEffect, useRef, useState } from 'react';
import type { EgglineApi, LoadedStack, StackPreview, StackTimeOptions } from '../../core/contract';
import { timePointForFile, type AnalysisSettings } from '../../core/settings';

/** What the loader reports. */
export interface StackLoad {
  readonly stack: LoadedStack | null;
  readonly loading: boolean;
  readonly error: string | null;
  /** The first picture while the stack loads (one raw slice of `path`); null once the stack is there or when the
   *  preview failed (the stack's own error, if any, is what the user sees). */
  readonly preview: { readonly path: string; readonly plane: StackPreview } | null;
  /** The time point the stack shows (the settings' timeIndex it was loaded with, or the file's last when it has
   *  fewer time points), or null with no stack. */
  readonly timeIndex: number | null;
}

/** Settings that change what loadStack returns (projection, detection); others only change live measurement. */
export function loadKey(path: string | null, s: AnalysisSettings, time: StackTimeOptions | null = null): string {
  return JSON.stringify([path, s.projection, s.sliceIndex, s.timeIndex, s.pixelSizeUm, s.anterior, s.gradientChannel, s.flatFieldFile, s.backgroundImageFile, time]);
}

/** Load `path` with `settings` at the settings' time point (a movie's in the movie's embryo, read with `time`'s time
 *  step); stale answers (the user moved on) are dropped, and the app stops the stale load itself. */
export function useStackLoader(api: EgglineApi | null, path: string | null, settings: AnalysisSettings, time: StackTimeOptions | null = null): StackLoad {
  const [load, setLoad] = useState<StackLoad>({ stack: null, loading: false, error: null, preview: null, timeIndex: null });
  const key = loadKey(path, settings, time);
  // The key the shown stack answers (with the time point it shows): a request past the file's last time point is
  // answered by the last, so asking for that one next needs no second load.
  const served = useRef<string | null>(null);
  useEffect(() => {
    if (api === null || path === null || key === served.current) return;
    served.current = null;
    let live = true;
    setLoad((l) => ({ ...l, loading: true, error: null, preview: null }));
    let stackArrived = false;
    // The preview is asked for first and shown only until the stack arrives: a slice decodes in a few hundredths of
    // a second, the projection and detection of a large stack take most of a second.
    if (api.loadPreview !== undefined && (load.stack === null || load.stack.path !== path)) {
      api.loadPreview(path).then((r) => {
        if (live && !stackArrived && r.ok) setLoad((l) => ({ ...l, preview: { path, plane: r.value } }));
      }, () => undefined);
    }
    api.loadStack(path, settings, time).then((r) => {
      if (!live) return;
      stackArrived = true;
      if (!r.ok) { setLoad({ stack: null, loading: false, error: r.error.message, preview: null, timeIndex: null }); return; }
      const t = timePointForFile(settings.timeIndex, r.value.info.sizeT, path).tIndex;
      served.current = loadKey(path, { ...settings, timeIndex: t }, time);
      setLoad({ stack: r.value, loading: false, error: null, preview: null, timeIndex: t });
    }, (e: unknown) => { if (live) { stackArrived = true; setLoad({ stack: null, loading: false, error: `${path}: ${String(e)}`, preview: null, timeIndex: null }); } });
    return () => { live = false; };
    // The key captures every setting that matters; settings itself changes on unrelated edits.
  }, [api, key]);
  return load;
}
