// Adapters to the modules of other areas that the batch uses (decoder, pipeline), kept in one place.
import { promises as fs } from 'node:fs';
import type { EmbryoResult, HandEdits, PlaneSource, StackInfo } from '../../core/model';
import type { AnalysisSettings } from '../../core/settings';
import type { ByteSource } from '../../core/tiff';

/** Open a stack for analysis: its tag info and a plane source (sharp decoding). */
export async function openStack(path: string, label: string): Promise<{ info: StackInfo; source: PlaneSource }> {
  void path;
  throw new Error(`${label}: the stack decoder is not part of this build yet`);
}

/** Analyse one opened stack (never throws for bad data: returns status 'error'). */
export async function analyze(
  info: StackInfo, source: PlaneSource, settings: AnalysisSettings, opts: { fileLabel: string; handEdits?: HandEdits },
): Promise<EmbryoResult> {
  void info; void source; void settings;
  throw new Error(`${opts.fileLabel}: the analysis pipeline is not part of this build yet`);
}

/** A byte-range reader over a file (with close), for reading tags without loading the file. */
export async function openByteSource(path: string): Promise<ByteSource & { close(): Promise<void> }> {
  const handle = await fs.open(path, 'r');
  const { size } = await handle.stat();
  return {
    size,
    read: async (offset: number, length: number) => {
      const start = Math.min(Math.max(0, offset), size);
      const buf = new Uint8Array(Math.max(0, Math.min(length, size - start)));
      const { bytesRead } = await handle.read(buf, 0, buf.length, start);
      return buf.subarray(0, bytesRead);
    },
    close: () => handle.close(),
  };
}
