// Which files (and OME-Zarr folders) a batch reads, and in which order.

const STACK_SUFFIXES = ['.tif', '.tiff', '.btf', '.tf8', '.tf2'];

/** True for names a batch analyses: .tif, .tiff, .ome.tif(f), .btf, .tf8, .tf2 (any case); hidden files (".name") are skipped. */
export function isStackFileName(name: string): boolean {
  const lower = name.toLowerCase();
  return !name.startsWith('.') && STACK_SUFFIXES.some((s) => lower.endsWith(s));
}

/** True for folder names read as one OME-Zarr stack: *.zarr, which covers *.ome.zarr (any case); hidden folders skipped. */
export function isStackFolderName(name: string): boolean {
  return !name.startsWith('.') && name.toLowerCase().endsWith('.zarr');
}

/** Sort relative paths (forward slashes) by code unit, so the order is the same on every machine and locale. */
export function sortStackPaths(paths: readonly string[]): string[] {
  return [...paths].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}
