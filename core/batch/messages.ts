// Error and warning text for table cells: one line, at most MAX_CELL_CHARS characters, repeats collapsed.
import type { EmbryoResult } from '../model';

/** Longest error or warnings cell, characters. */
export const MAX_CELL_CHARS = 300;

/** Line breaks and runs of white space folded into one space, trimmed. */
function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

/** `text` on one line and cut to `max` characters (ending in "…" when cut; never splits a surrogate pair). */
export function clipMessage(text: string, max: number = MAX_CELL_CHARS): string {
  const line = oneLine(text);
  if (line.length <= max) return line;
  let cut = max - 1;
  const code = line.charCodeAt(cut - 1);
  if (code >= 0xd800 && code <= 0xdbff) cut -= 1;
  return `${line.slice(0, cut)}…`;
}

/** Messages that differ only in their numbers count as repeats of one another ("strip 3 …", "strip 4 …"). */
function repeatKey(message: string): string {
  return message.replace(/[-+]?\d+(\.\d+)?/g, '#');
}

/** Each message once, in first-seen order, clipped; a message repeated (or differing only in numbers) n > 1 times
 *  becomes "first one (×n)". */
export function collapseMessages(messages: readonly string[]): string[] {
  const order: string[] = [];
  const seen = new Map<string, { first: string; count: number }>();
  for (const m of messages) {
    const line = oneLine(m);
    if (line === '') continue;
    const key = repeatKey(line);
    const hit = seen.get(key);
    if (hit) hit.count += 1;
    else { seen.set(key, { first: line, count: 1 }); order.push(key); }
  }
  return order.map((key) => {
    const { first, count } = seen.get(key) as { first: string; count: number };
    const suffix = count > 1 ? ` (×${count})` : '';
    return `${clipMessage(first, MAX_CELL_CHARS - suffix.length)}${suffix}`;
  });
}

/** The warnings cell: messages joined by "; ", cut at whole messages to fit MAX_CELL_CHARS, ending with how many
 *  were left out ("… and 3 more warnings, see results.json"). */
export function warningsCell(warnings: readonly string[]): string {
  const all = collapseMessages(warnings);
  const joined = all.join('; ');
  if (joined.length <= MAX_CELL_CHARS) return joined;
  const tail = (rest: number): string => `… and ${rest} more warning${rest === 1 ? '' : 's'}, see results.json`;
  for (let keep = all.length - 1; keep >= 1; keep -= 1) {
    const cell = `${all.slice(0, keep).join('; ')}; ${tail(all.length - keep)}`;
    if (cell.length <= MAX_CELL_CHARS) return cell;
  }
  const last = tail(all.length - 1);
  return `${clipMessage(all[0], MAX_CELL_CHARS - last.length - 2)}; ${last}`;
}

/** The result with a clipped one-line error and collapsed warnings (each at most MAX_CELL_CHARS). */
export function tidyMessages(result: EmbryoResult): EmbryoResult {
  return { ...result, error: result.error === null ? null : clipMessage(result.error), warnings: collapseMessages(result.warnings) };
}
