// Resolves channel references (1-based index or name) against a stack's channel names.
import type { ChannelRef } from '../../core/settings';

/** 0-based channel index for a reference (1-based number or name), or null when it names no channel. */
export function resolveChannel(ref: ChannelRef, names: readonly string[]): number | null {
  if (typeof ref === 'number') return Number.isInteger(ref) && ref >= 1 && ref <= names.length ? ref - 1 : null;
  const i = names.indexOf(ref);
  return i >= 0 ? i : null;
}
