// Memory sizes as the command line takes them ("4G", "512M", "1.5GiB", "2000000000") and as messages show them.
import { flagValue, runSettingSpec } from '../settings';

/** Bytes from "N", "N K|M|G|T" with an optional "B" or "iB" (units are powers of 1024), at least 64M, by the run
 *  setting --max-memory's rule; throws BatchOptionError naming `flag`. */
export function parseByteSize(text: string, flag: string): number {
  return flagValue({ ...runSettingSpec('maxMemoryBytes'), flag }, text) as number;
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
