// The reference stack of the OME-Zarr tests: a small synthetic embryo written as an uncompressed OME-TIFF (demo data).
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import type { EmbryoResult, PlaneSource } from '../../core/model';
import { makeSyntheticEmbryo, type SyntheticEmbryo } from '../../core/synth';
import { writeOmeTiff } from '../../core/tiff';
import type { V3Source } from '../../scripts/make-zarr-v3-fixtures';

/** Debian's Python, which has numpy, tifffile, zarr and numcodecs (the pyenv python3 on PATH may not). */
export const PYTHON = '/usr/bin/python3';

/** Why the Python-written fixtures cannot be made here, or null when they can. */
export function pythonZarrMissing(): string | null {
  const r = spawnSync(PYTHON, ['-c', 'import zarr, numcodecs, tifffile'], { encoding: 'utf8' });
  return r.status === 0 ? null : `${PYTHON} cannot import zarr, numcodecs and tifffile (${(r.stderr || r.error?.message || '').trim().split('\n').pop()})`;
}

/** Pixel size, z step and channel names of the reference stack (demo data). */
export const REFERENCE = { pixelSizeUm: 3, zStepUm: 2, channels: ['gradient', 'boundary'] } as const;

/** Demo data: a 2-channel, 3-slice synthetic embryo, 200×130 px, and the OME-TIFF holding it. */
export function writeReferenceTiff(dir: string): { path: string; embryo: SyntheticEmbryo } {
  const embryo = makeSyntheticEmbryo({ widthPx: 200, heightPx: 130, sizeZ: 3, pixelSizeUm: REFERENCE.pixelSizeUm, zStepUm: REFERENCE.zStepUm, angleDeg: 20 }, 7);
  const { sizeX, sizeY, sizeZ, sizeC, planes } = embryo.stack;
  const bytes = writeOmeTiff(planes.map((data) => ({ width: sizeX, height: sizeY, data })), {
    sizeZ, sizeC, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: [...REFERENCE.channels],
    physicalSizeXUm: REFERENCE.pixelSizeUm, physicalSizeZUm: REFERENCE.zStepUm,
  });
  const path = join(dir, 'reference.ome.tif');
  writeFileSync(path, bytes);
  return { path, embryo };
}

/** Runs scripts/make-zarr-fixtures.py on the reference TIFF; returns the case names it wrote. */
export function writePythonStores(tiff: string, out: string, cases: readonly string[] = []): string[] {
  const script = join(__dirname, '../../scripts/make-zarr-fixtures.py');
  const r = spawnSync(PYTHON, [script, tiff, out, '--pixel-size-um', String(REFERENCE.pixelSizeUm), '--z-step-um', String(REFERENCE.zStepUm),
    '--channels', REFERENCE.channels.join(','), ...cases], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`make-zarr-fixtures.py failed: ${r.stderr}`);
  return r.stdout.trim().split('\n');
}

/** The reference embryo as the source of zarrita's v3 stores (the same pixels as the TIFF). */
export function v3Source(embryo: SyntheticEmbryo): V3Source {
  const { sizeX, sizeY, sizeZ, sizeC, planes } = embryo.stack;
  return { sizeX, sizeY, sizeZ, sizeC, planes: planes as Uint16Array[], pixelSizeUm: REFERENCE.pixelSizeUm, zStepUm: REFERENCE.zStepUm, channels: REFERENCE.channels };
}

/** Every plane of an opened stack, in (z, c) order. */
export async function allPlanes(opened: { info: { sizeZ: number; sizeC: number }; source: PlaneSource }): Promise<number[][]> {
  const out: number[][] = [];
  for (let z = 0; z < opened.info.sizeZ; z++) {
    for (let c = 0; c < opened.info.sizeC; c++) out.push(Array.from((await opened.source.readPlane(z, c, 0)).data));
  }
  return out;
}

/**
 * A result without the fields that name the file, the pixel size's source or the time point's time (an NGFF time
 * axis with a scale gives t = 0 s; the OME-TIFF fixture has no time), for comparing two readers.
 */
export const comparableResult = (r: EmbryoResult) => ({ ...r, file: '', pixelSizeSource: '', tS: null });
