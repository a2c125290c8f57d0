// libvips (inside sharp) keeps its own thread pool per process; with several batch workers we shrink it so the
// workers do not fight over the cores, and turn its cache off because every plane is read once.
import sharp from 'sharp';

/** Set libvips threads for this process (≥ 1) and disable its operation cache. */
export function limitDecoderThreads(threads: number): void {
  sharp.concurrency(Math.max(1, Math.floor(threads)));
  sharp.cache(false);
}
