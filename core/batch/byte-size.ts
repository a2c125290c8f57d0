// Memory sizes as the command line takes them ("4G", "512M", "1.5GiB", "2000000000") and as messages show them.
import { BatchOptionError } from './option-error';

const UNIT_POWERS: Readonly<Record<string, number>> = { '': 0, K: 1, M: 2, G: 3, T: 4 };

/** Bytes from "N", "N K|M|G|T" with an optional "B" or "iB" (units are powers of 1024); throws BatchOptionError. */
export function parseByteSize(text: string, flag: string): number {
  const m = /^\s*(\d+(?:\.\d+)?)\s*([kmgt]?)(?:i?b)?\s*$/i.exec(text);
  const bytes = m ? Number(m[1]) * 1024 ** (UNIT_POWERS[m[2].toUpperCase()] ?? 0) : Number.NaN;
  if (!(bytes >= 2 ** 26) || !Number.isFinite(bytes)) {
    throw new BatchOptionError(`${flag} must be a size of at least 64M, like 512M, 4G or 1.5G (got "${text}")`);
  }
  return Math.floor(bytes);
}

/** "2.0 GiB", "512 MiB" for messages. */
export function formatByteSize(bytes: number): string {
  const gib = bytes / 2 ** 30;
  return gib >= 1 ? `${gib.toFixed(1)} GiB` : `${Math.round(bytes / 2 ** 20)} MiB`;
}

/** Default memory per file: three quarters of the machine's memory shared among the jobs, between 1 and 8 GiB. */
export function defaultMaxMemoryBytes(totalMemoryBytes: number, jobs: number): number {
  return Math.min(8 * 2 ** 30, Math.max(2 ** 30, Math.floor((0.75 * totalMemoryBytes) / Math.max(1, jobs))));
}
