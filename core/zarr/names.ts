// Which folder names are read as OME-Zarr stores.

/** True for folder names ending in .zarr (which covers .ome.zarr), any case; hidden names are skipped. */
export function isZarrStoreName(name: string): boolean {
  return !name.startsWith('.') && name.toLowerCase().endsWith('.zarr');
}
