// The few batch settings a reader needs to judge the numbers, picked from the run record (any shape; missing → skipped).

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

function profileText(p: unknown): string {
  const mode = at(p, ['mode']);
  if (mode === 'edge') return `edge band, ${String(at(p, ['edgeSide']) ?? '?')} side(s), ${String(at(p, ['edgeDepthUm']) ?? '?')} µm deep`;
  if (mode === 'axis') return `strip along the axis, ${String(at(p, ['axisWidthUm']) ?? '?')} µm wide`;
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

/** [setting, value] rows: gradient and boundary channels, projection, profile mode, fit range, background. */
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
  ];
  return rows.filter(([, v]) => v !== '');
}
