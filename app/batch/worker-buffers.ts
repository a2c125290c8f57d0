// Arrays a batch worker lends to the analysis of each of its files in turn: the planes are decoded into them and the
// projection is written into them, so a file's planes and projection are no new arrays. Typed arrays live outside
// V8's heap, but their total drives its full collections: decoding and projecting made about three of them per
// microscope-shaped stack (node --trace-gc). The worker owns one set for its whole life (app/workers/batch-worker.ts)
// and analyses one file at a time, so nothing else ever holds them.
import type { PixelArray, SampleType } from '../../core/model';
import type { PlaneArrays } from '../../core/image';

const ARRAYS: Record<SampleType, { new (buffer: ArrayBuffer, byteOffset: number, length: number): PixelArray; readonly BYTES_PER_ELEMENT: number }> = {
  uint8: Uint8Array, int8: Int8Array, uint16: Uint16Array, int16: Int16Array,
  uint32: Uint32Array, int32: Int32Array, float32: Float32Array, float64: Float64Array,
};

/** A worker's lent arrays: the plane slots and one projection array per channel. */
export interface WorkerBuffers {
  /** Plane slots (PlaneArrays): each a view of one buffer per slot that grows to the largest plane seen. */
  readonly planeArrays: PlaneArrays;
  /** One array of `length` floats per channel for the projection (views of buffers kept per channel). */
  projection(channels: number, length: number): Float32Array[];
}

/** Buffers that grow to the largest size asked for and are never shrunk: a view of `bytes` bytes of buffer `k`. */
function growingBuffers(): (k: number, bytes: number) => ArrayBuffer {
  const buffers: ArrayBuffer[] = [];
  return (k, bytes) => {
    const kept = buffers[k];
    if (kept !== undefined && kept.byteLength >= bytes) return kept;
    const made = new ArrayBuffer(bytes);
    buffers[k] = made;
    return made;
  };
}

/**
 * A new set of worker buffers. Arrays of different files may have different sizes and sample types: each is a view
 * of its slot's buffer, grown when a larger one is asked for, so a worker keeps at most its largest file's planes
 * (two, or one per channel for one-slice stacks) and projection. The contents of a view are overwritten by the next
 * file; a plane slot, as PlaneArrays says, by the next plane in that slot.
 */
export function workerBuffers(): WorkerBuffers {
  const planes = growingBuffers();
  const projections = growingBuffers();
  // The view last lent per slot: the same array while slot, sample type and length repeat (as PlaneArrays promises).
  const views: PixelArray[] = [];
  return {
    planeArrays: {
      at(slot: number, type: SampleType, length: number): PixelArray {
        const Array_ = ARRAYS[type];
        const buffer = planes(slot, length * Array_.BYTES_PER_ELEMENT);
        const kept = views[slot];
        if (kept !== undefined && kept.buffer === buffer && kept.constructor === Array_ && kept.length === length) return kept;
        const view = new Array_(buffer, 0, length);
        views[slot] = view;
        return view;
      },
    },
    projection(channels, length) {
      return Array.from({ length: channels }, (_, c) => new Float32Array(projections(c, length * 4), 0, length));
    },
  };
}
