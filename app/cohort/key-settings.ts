// The few batch settings a reader needs to judge the numbers, picked from the run record (any shape; missing → skipped).
import { PROFILE_SAMPLERS } from '../../core/pipeline';

function at(value: unknown, path: readonly string[]): unknown {
  let v = value;
  for (const k of path) {
    if (v === null || typeof v !== 'object' || Array.isArray(v)) return undefined;
    v = (v as Record<string, unknown>)[k];
  }
  return v;
}

/** A channel reference (1-based index or name stored in the file) as text. */
function channel(v: unknown): string {
  return typeof v === 'number' ? `channel ${v}` : typeof v === 'string' ? `channel ‘${v}’` : '';
}

/** How the profile was sampled, in the words of the run's sampler (the mode's name when no sampler has it). */
function profileText(p: unknown): string {
  const mode = at(p, ['mode']);
  const sampler = PROFILE_SAMPLERS.find((s) => s.mode === mode);
  if (sampler !== undefined) return sampler.describe((key) => at(p, [key]));
  return typeof mode === 'string' ? mode : '';
}

function backgroundText(b: unknown): string {
  const mode = at(b, ['mode']);
  if (mode === 'outside') return 'outside the embryo';
  if (mode === 'region') {
    const r = at(b, ['regionPx']);
    const [x, y, w, h] = ['x', 'y', 'width', 'height'].map((k) => at(r, [k]));
    return `region x ${String(x)}, y ${String(y)}, ${String(w)} × ${String(h)} px`;
  }
  return mode === 'none' ? 'none (raw intensities)' : typeof mode === 'string' ? mode : '';
}

/** "flat.tif (SHA-256 1a2b3c4d5e6f…)" for a correction image of the run record, '' when none was used. */
function imageText(entry: unknown): string {
  const file = at(entry, ['file']);
  const sha = at(entry, ['sha256']);
  if (typeof file !== 'string') return '';
  return typeof sha === 'string' ? `${file} (SHA-256 ${sha.slice(0, 12)}…)` : file;
}

/** [setting, value] rows: gradient and boundary channels, projection, profile mode, fit range, background, and the
 *  flat-field and background images when the run used them. */
export function keySettings(runRecord: unknown): [string, string][] {
  const s = at(runRecord, ['settings']);
  const boundaries = at(s, ['boundaryChannels']);
  const range = at(s, ['fitRangeEl']);
  const rows: [string, string][] = [
    ['gradient channel', channel(at(s, ['gradientChannel']))],
    ['boundary channels', Array.isArray(boundaries) ? (boundaries.map(channel).filter((t) => t !== '').join(', ') || 'none') : ''],
    ['projection', typeof at(s, ['projection']) === 'string' ? String(at(s, ['projection'])) : ''],
    ['profile', profileText(at(s, ['profile']))],
    ['fit range', Array.isArray(range) && range.length === 2 ? `${String(range[0])} to ${String(range[1])} x/EL` : ''],
    ['background', backgroundText(at(s, ['background']))],
    ['background image (subtracted)', imageText(at(runRecord, ['corrections', 'backgroundImage']))],
    ['flat-field image (divided by)', imageText(at(runRecord, ['corrections', 'flatField']))],
  ];
  return rows.filter(([, v]) => v !== '');
}
