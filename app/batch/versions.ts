// Software versions recorded in every run record.
import type { SoftwareVersions } from '../../core/batch';
import pkg from '../../package.json';

/** This program's version (from package.json). */
export const EGGLINE_VERSION: string = pkg.version;

/** Versions of Eggline, Node, sharp and libvips (null when unknown). sharp is loaded lazily: commands that never
 *  decode (help, usage errors) start faster without its native library. */
export async function softwareVersions(): Promise<SoftwareVersions> {
  const mod = await import('sharp').catch(() => null);
  const v = (mod?.default as unknown as { versions?: Record<string, string | undefined> } | undefined)?.versions ?? {};
  return { eggline: EGGLINE_VERSION, node: process.versions.node, sharp: v.sharp ?? null, libvips: v.vips ?? null };
}
