// Flatten a run record (any JSON value) into "key: value" rows for a readable settings table.

/** Rows of dotted keys and printable values; arrays of plain values are joined, longer lists are counted. */
export function flattenRecord(value: unknown, prefix = '', maxRows = 80): [string, string][] {
  const rows: [string, string][] = [];
  const walk = (v: unknown, key: string): void => {
    if (rows.length >= maxRows) return;
    if (v === null || v === undefined) rows.push([key, '—']);
    else if (Array.isArray(v)) {
      const plain = v.every((x) => x === null || ['string', 'number', 'boolean'].includes(typeof x));
      rows.push([key, plain ? v.map((x) => String(x)).join(', ') || '(none)' : `${v.length} entries (see the full record)`]);
    } else if (typeof v === 'object') {
      const entries = Object.entries(v as Record<string, unknown>);
      if (entries.length === 0) rows.push([key, '(empty)']);
      for (const [k, x] of entries) walk(x, key ? `${key}.${k}` : k);
    } else rows.push([key, String(v)]);
  };
  walk(value, prefix);
  return rows;
}
