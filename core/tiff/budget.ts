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
