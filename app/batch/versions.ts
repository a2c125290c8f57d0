// Software versions recorded in every run record.
import sharp from 'sharp';
import type { SoftwareVersions } from '../../core/batch';
import pkg from '../../package.json';

/** This program's version (from package.json). */
export const EGGLINE_VERSION: string = pkg.version;

/** Versions of Eggline, Node, sharp and libvips (null when unknown). */
export function softwareVersions(): SoftwareVersions {
  const v = (sharp as unknown as { versions?: Record<string, string | undefined> }).versions ?? {};
  return { eggline: EGGLINE_VERSION, node: process.versions.node, sharp: v.sharp ?? null, libvips: v.vips ?? null };
}
