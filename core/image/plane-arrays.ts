// Arrays that decoded planes are read into again and again (a movie's time points), so no plane is a new array.
import type { PixelArray, SampleType } from '../model';

const ARRAYS: Record<SampleType, new (length: number) => PixelArray> = {
  uint8: Uint8Array, int8: Int8Array, uint16: Uint16Array, int16: Int16Array,
  uint32: Uint32Array, int32: Int32Array, float32: Float32Array, float64: Float64Array,
};

/**
 * Arrays lent to PlaneSource.readPlane: `at(slot, type, length)` is the same array whenever slot, sample type and
 * length repeat (a new one when they change), so its previous contents are overwritten. The caller decides which
 * planes may share a slot (those never held at the same time).
 */
export interface PlaneArrays {
  at(slot: number, type: SampleType, length: number): PixelArray;
}

/** A new, empty set of PlaneArrays; its arrays are made on first use and live as long as it does. */
export function reusedPlaneArrays(): PlaneArrays {
  const slots: PixelArray[] = [];
  return {
    at(slot, type, length) {
      const kept = slots[slot];
      if (kept !== undefined && kept.constructor === ARRAYS[type] && kept.length === length) return kept;
      const made = new ARRAYS[type](length);
      slots[slot] = made;
      return made;
    },
  };
}
