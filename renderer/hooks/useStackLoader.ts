// Loads the shown file through the API whenever it or a setting that changes loading changes.
import { useEffect, useState } from 'react';
import type { EgglineApi, LoadedStack } from '../../core/contract';
import type { AnalysisSettings } from '../../core/settings';

/** What the loader reports. */
export interface StackLoad {
  readonly stack: LoadedStack | null;
  readonly loading: boolean;
  readonly error: string | null;
}

/** Settings that change what loadStack returns (projection, detection); others only change live measurement. */
export function loadKey(path: string | null, s: AnalysisSettings): string {
  return JSON.stringify([path, s.projection, s.sliceIndex, s.timeIndex, s.pixelSizeUm, s.anterior, s.gradientChannel]);
}

/** Load `path` with `settings`; stale answers (the user moved on) are dropped. */
export function useStackLoader(api: EgglineApi | null, path: string | null, settings: AnalysisSettings): StackLoad {
  const [load, setLoad] = useState<StackLoad>({ stack: null, loading: false, error: null });
  const key = loadKey(path, settings);
  useEffect(() => {
    if (api === null || path === null) return;
    let live = true;
    setLoad((l) => ({ ...l, loading: true, error: null }));
    api.loadStack(path, settings).then((r) => {
      if (!live) return;
      setLoad(r.ok ? { stack: r.value, loading: false, error: null } : { stack: null, loading: false, error: r.error.message });
    }, (e: unknown) => live && setLoad({ stack: null, loading: false, error: `${path}: ${String(e)}` }));
    return () => { live = false; };
    // The key captures every setting that matters; settings itself changes on unrelated edits.
  }, [api, key]);
  return load;
}
