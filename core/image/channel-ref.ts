// Resolve a channel reference (1-based number or a name stored in the file) to a 0-based index.
import type { ChannelRef } from '../settings';

/** 0-based index of the channel `ref` (1-based number or case-insensitive name), or null when the file lacks it. */
export function resolveChannel(ref: ChannelRef, channelNames: readonly string[]): number | null {
  if (typeof ref === 'number') {
    return Number.isInteger(ref) && ref >= 1 && ref <= channelNames.length ? ref - 1 : null;
  }
  const want = ref.trim().toLowerCase();
  const byName = channelNames.findIndex((n) => n.trim().toLowerCase() === want);
  if (byName >= 0) return byName;
  // A numeric string from a config file or a command line means a 1-based index.
  return /^\d+$/.test(want) ? resolveChannel(Number(want), channelNames) : null;
}

/** Human-readable form of a channel reference for messages, e.g. `channel 3` or `channel "marker"`. */
export function describeChannelRef(ref: ChannelRef): string {
  return typeof ref === 'number' ? `channel ${ref}` : `channel "${ref}"`;
}
