// The renderer's only way to reach the app: window.eggline, typed by the contract.
import type { EgglineApi } from '../core/contract';

declare global {
  interface Window {
    eggline?: EgglineApi;
  }
}

/** The API object, or null when the page runs without the app (then the UI explains that instead of failing). */
export function getApi(): EgglineApi | null {
  return typeof window !== 'undefined' && window.eggline !== undefined ? window.eggline : null;
}
