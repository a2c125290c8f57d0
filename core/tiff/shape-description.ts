// The JSON ImageDescription Python's tifffile writes by default, e.g. {"shape": [5, 3, 512, 512]}.

/** Z, C and T read from a tifffile shape, or null when the description is not one or does not fit the file. */
export interface ShapeDescription {
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly sizeT: number;
  /** The shape as written, for messages. */
  readonly shape: readonly number[];
}

/**
 * Reads `{"shape": [...]}`. The last two numbers are Y and X (the last three Y, X and samples, or samples, Y and X,
 * when the file has several samples per pixel); what stands before them is read, by tifffile's row-major page order, as [Z],
 * [Z, C] or [T, Z, C] (tifffile records no axis names, so this is a convention; the caller warns). Null when the
 * text is not such JSON, the image size differs, or the leading sizes do not multiply to `pages`.
 */
export function parseShapeDescription(description: string, widthPx: number, heightPx: number, samplesPerPixel: number, pages: number): ShapeDescription | null {
  const text = description.trim();
  if (!text.startsWith('{') || !text.includes('"shape"')) return null;
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    return null;
  }
  const shape = (parsed as { shape?: unknown }).shape;
  if (!Array.isArray(shape) || !shape.every((v) => Number.isInteger(v) && v > 0)) return null;
  // Samples come last for chunky files ([…, Y, X, S]) and before Y and X for planar ones ([…, S, Y, X]).
  const tails = samplesPerPixel > 1 ? [[heightPx, widthPx, samplesPerPixel], [samplesPerPixel, heightPx, widthPx]] : [[heightPx, widthPx]];
  const tail = tails.find((t) => shape.length >= t.length && t.every((v, i) => shape[shape.length - t.length + i] === v));
  if (!tail) return null;
  const lead = (shape as number[]).slice(0, shape.length - tail.length);
  if (lead.reduce((a, b) => a * b, 1) !== pages || lead.length > 3) return null;
  const [sizeT, sizeZ, sizeC] = lead.length === 3 ? lead : lead.length === 2 ? [1, lead[0], lead[1]] : [1, lead[0] ?? 1, 1];
  return { sizeZ, sizeC, sizeT, shape: shape as number[] };
}
