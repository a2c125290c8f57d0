// Declared image size against the file size and a memory budget, checked before any decoding.
import type { SampleType } from '../model';
import { TiffError } from './errors';
import type { ImageLayout } from './layout';
import { bytesPerSample } from './sample-type';

/** Best case bytes of output per byte of input for each compression (a bound, so only absurd sizes fail). */
function maxExpansion(compression: number): number {
  if (compression === 1) return 1;
  if (compression === 32773) return 64; // PackBits: 2 bytes → at most 128 (TIFF 6.0 §9)
  return 5000; // LZW (12-bit codes), Deflate (≈1032:1) and others
}

/** "2.0 GB", "812 KB", "17 bytes" for messages. */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  const units = ['KB', 'MB', 'GB', 'TB', 'PB'];
  let value = bytes / 1024;
  let i = 0;
  while (value >= 1024 && i < units.length - 1) { value /= 1024; i++; }
  return `${value.toFixed(1)} ${units[i]}`;
}

/** Throws 'truncated' when one plane cannot fit in the file, 'too-large' when it exceeds maxPlaneBytes. */
export function checkPlaneBudget(layout: ImageLayout, type: SampleType, fileBytes: number, maxPlaneBytes: number, fileLabel: string): void {
  const planeBytes = layout.widthPx * layout.heightPx * layout.samplesPerPixel * bytesPerSample(type);
  const dims = `${layout.widthPx}×${layout.heightPx}${layout.samplesPerPixel > 1 ? `×${layout.samplesPerPixel}` : ''} ${type}`;
  if (planeBytes > fileBytes * maxExpansion(layout.compression)) {
    throw new TiffError('truncated', fileLabel, `declares ${dims} pixels per plane (${formatBytes(planeBytes)}) but the file has only ${formatBytes(fileBytes)}`);
  }
  if (planeBytes > maxPlaneBytes) {
    throw new TiffError('too-large', fileLabel, `one plane of ${dims} pixels needs ${formatBytes(planeBytes)}, over the ${formatBytes(maxPlaneBytes)} limit`);
  }
}

/** Resident bytes of a worker process before it opens a file (Node, sharp and libvips loaded), measured with
 *  `npm run bench` on Linux: about 100–150 MiB; the budget reserves the upper figure. */
export const WORKER_BASE_BYTES = 150 * 2 ** 20;

/**
 * Bytes the analysis of one stack holds at its peak, estimated from one plane's pixel count: per channel a float
 * projection, its smoothed copy and the straightened samples (about 24 bytes a pixel), the masks, distance map and
 * labels shared by all channels (about 48), and two raw planes in flight (one read ahead). `npm run bench` measured
 * at most 1.56 × 96 MiB for 1024×1024 pixels × 2 channels × 24 slices, about 150 bytes a pixel with the base
 * included; this estimate gives 101 bytes a pixel plus WORKER_BASE_BYTES for that stack.
 */
export function analysisBytesEstimate(sizeX: number, sizeY: number, sizeC: number, type: SampleType, samplesPerPixel: number): number {
  const pixels = sizeX * sizeY;
  return pixels * (24 * sizeC + 48 + 2 * bytesPerSample(type) * samplesPerPixel);
}
