// The files of one part of a split batch (`eggline batch --shard K/N`) and what its run.json records about the split.
import { createHash } from 'node:crypto';
import { promises as fs } from 'node:fs';
import { join } from 'node:path';
import type { ShardInfo } from '../../core/batch';
import type { StackInfo } from '../../core/model';
import { bytesPerSample } from '../../core/tiff';
import { filesOfPart, inputListText, partFolderName, type ShardSpec, type SizedFile } from '../../core/shard';
import { openStack } from './deps';
import { listStackFiles, type StackFile } from './list-stacks';

/** Folder under the batch's --out that one part writes to: `<out>/parts/K-of-N`. */
export function partDir(outDir: string, spec: ShardSpec): string {
  return join(outDir, 'parts', partFolderName(spec));
}

/** Hex SHA-256 of a string (UTF-8). */
export function sha256Text(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

/** The StackInfo of a TIFF file or OME-Zarr store (metadata only, nothing decoded), or null when it cannot be opened. */
export async function stackInfoOf(path: string): Promise<StackInfo | null> {
  try {
    const opened = await openStack(path, path);
    await opened.source.close().catch(() => undefined);
    return opened.info;
  } catch {
    return null;
  }
}

/** Bytes that stand for a stack's work: a file's size; for an OME-Zarr store (a folder of chunk files) the decoded size
 *  its metadata declares, as summing thousands of chunk files on every task would be slow. 0 when unreadable. */
export async function workBytes(path: string): Promise<number> {
  const stat = await fs.stat(path).catch(() => null);
  if (stat === null) return 0;
  if (!stat.isDirectory()) return stat.size;
  const i = await stackInfoOf(path);
  return i ? i.sizeX * i.sizeY * i.sizeZ * i.sizeC * i.sizeT * i.samplesPerPixel * bytesPerSample(i.sampleType) : 0;
}

/** Work bytes of the files in list order (see workBytes); a file that cannot be read counts as 0 (it gets an error row later). */
export async function sizedFiles(files: readonly StackFile[]): Promise<SizedFile[]> {
  const out: SizedFile[] = new Array(files.length);
  const width = 64;
  for (let start = 0; start < files.length; start += width) {
    const chunk = files.slice(start, start + width);
    const sizes = await Promise.all(chunk.map((f) => workBytes(f.path)));
    chunk.forEach((f, i) => { out[start + i] = { file: f.file, bytes: sizes[i] }; });
  }
  return out;
}

/** SHA-256 of a project file's bytes, or null when there is none or it cannot be read. */
async function projectHash(projectFile: string | null): Promise<string | null> {
  if (projectFile === null) return null;
  return fs.readFile(projectFile).then((b) => createHash('sha256').update(b).digest('hex'), () => null);
}

/** The files of part `spec` of the sorted list `files` (balanced by size), and the split's facts for run.json. */
export async function selectPart(files: readonly StackFile[], spec: ShardSpec, projectFile: string | null): Promise<{ files: StackFile[]; info: ShardInfo }> {
  const sized = await sizedFiles(files);
  const bytes = sized.map((f) => f.bytes);
  const mine = filesOfPart(bytes, spec.part, spec.parts).map((i) => files[i]);
  return {
    files: mine,
    info: {
      part: spec.part, parts: spec.parts, inputCount: files.length, inputBytes: bytes.reduce((a, b) => a + b, 0),
      inputListSha256: sha256Text(inputListText(sized)), projectSha256: await projectHash(projectFile),
    },
  };
}

/** The files the given parts would analyse, from the input folder as it is now; null when the folder cannot be listed
 *  or its list is no longer the one the parts were made from (`inputListSha256`). */
export async function filesOfMissingParts(
  folder: string, outDir: string, parts: number, missing: readonly number[], inputListSha256: string,
): Promise<string[] | null> {
  if (missing.length === 0) return [];
  const listed = await listStackFiles(folder, [outDir]).catch(() => null);
  if (listed === null) return null;
  const sized = await sizedFiles(listed);
  if (sha256Text(inputListText(sized)) !== inputListSha256) return null;
  const bytes = sized.map((f) => f.bytes);
  return missing.flatMap((k) => filesOfPart(bytes, k, parts).map((i) => sized[i].file));
}
