// Grey-level dilation (running maximum) over a square window, separable so the cost is O(N) whatever the window.
import type { Plane } from '../model';

/*
 * Both passes use the van Herk / Gil–Werman running maximum: the line is cut into blocks of the window length
 * w = 2r + 1; a forward prefix maximum g and a backward suffix maximum h within each block give the maximum of any
 * w-long window [a, a + w − 1] as max(h[a], g[a + w − 1]). The line is padded with r values below every pixel on
 * both sides, so windows clipped at the image border become full windows and need no special case.
 *
 * The comparisons run on integer keys, not on floats: a float comparison that feeds a branch mispredicts about half
 * the time on noisy images (≈ 5 ns each), while an integer maximum can be written without a branch. The key of a
 * float32 is its bit pattern with the magnitude bits flipped for negative numbers, which orders keys exactly as the
 * values (−0 just below +0), and maps back to the very same bits. The result is therefore exactly the maximum of
 * each window of the NaN-free input, as a direct search gives it.
 */

/** Smaller than the key of every float32 other than a NaN (used to pad lines beyond the image). */
const BELOW_ALL = -0x80000000;

/** Branch-free maximum of two int32 keys (x if x ≥ y, else y). */
function larger(x: number, y: number): number {
  return x ^ ((x ^ y) & (0 - +(x < y)));
}

/** Order-preserving int32 key of float32 bits b, and its inverse (the map is its own inverse). */
function flipKey(b: number): number {
  return b ^ ((b >> 31) & 0x7fffffff);
}

/**
 * Running maximum (as keys) of half-window r along the row of n float32 bit patterns at bits[o], written to
 * dst[d..d+n). `pad` (length n + 2r) must hold BELOW_ALL in its first and last r entries; g and h are scratch
 * lines of the same length.
 */
function maxRow(bits: Int32Array, o: number, n: number, r: number, dst: Int32Array, d: number, line: RowScratch): void {
  const { pad, g, h } = line;
  const w = 2 * r + 1;
  const len = n + 2 * r;
  flipRow(bits, o, pad, r, n);
  for (let k = 0; k < len; k += w) {
    const e = k + w < len ? k + w : len;
    let m = pad[k];
    g[k] = m;
    for (let j = k + 1; j < e; j++) { m = larger(m, pad[j]); g[j] = m; }
    m = pad[e - 1];
    h[e - 1] = m;
    for (let j = e - 2; j >= k; j--) { m = larger(m, pad[j]); h[j] = m; }
  }
  const span = 2 * r;
  maxOfRows(h, 0, g, span, dst, d, n);
}

/** Scratch lines of maxRow, allocated once per call. */
interface RowScratch { readonly pad: Int32Array; readonly g: Int32Array; readonly h: Int32Array }

/**
 * Rows of padded block b (padded row k = image row k − ry, BELOW_ALL outside the image) after the row pass, into
 * `rows` (w rows of `width`); rows past the last padded row are left as they
 * are (never read).
 */
function blockOfRows(plane: Plane, bits: Int32Array, b: number, rx: number, ry: number, rows: Int32Array, line: RowScratch): void {
  const { width, height } = plane;
  const w = 2 * ry + 1;
  for (let j = 0; j < w; j++) {
    const y = b * w + j - ry;
    if (y >= height + ry) break;
    if (y < 0 || y >= height) rows.fill(BELOW_ALL, j * width, (j + 1) * width);
    else maxRow(bits, y * width, width, rx, rows, j * width, line);
  }
}

/**
 * Within-block prefix (forward) or suffix (backward) maximum down the columns of a block of `count` rows, whole rows
 * at a time in memory order.
 */
function blockScan(rows: Int32Array, acc: Int32Array, width: number, count: number, forward: boolean): void {
  const first = forward ? 0 : count - 1;
  acc.set(rows.subarray(first * width, first * width + width), first * width);
  for (let j = 1; j < count; j++) {
    const o = (forward ? j : count - 1 - j) * width;
    const p = forward ? o - width : o + width;
    maxOfRows(acc, p, rows, o, acc, o, width);
  }
}

/**
 * dst[d + x] = larger(a[ao + x], b[bo + x]) for x < n, unrolled by four (independent elements; roughly halves the
 * per-element loop overhead in V8).
 */
function maxOfRows(a: Int32Array, ao: number, b: Int32Array, bo: number, dst: Int32Array, d: number, n: number): void {
  let x = 0;
  for (; x + 4 <= n; x += 4) {
    dst[d + x] = larger(a[ao + x], b[bo + x]);
    dst[d + x + 1] = larger(a[ao + x + 1], b[bo + x + 1]);
    dst[d + x + 2] = larger(a[ao + x + 2], b[bo + x + 2]);
    dst[d + x + 3] = larger(a[ao + x + 3], b[bo + x + 3]);
  }
  for (; x < n; x++) dst[d + x] = larger(a[ao + x], b[bo + x]);
}

/** dst[d + x] = flipKey(src[s + x]) for x < n (keys to float bits or back), unrolled by four. */
function flipRow(src: Int32Array, s: number, dst: Int32Array, d: number, n: number): void {
  let x = 0;
  for (; x + 4 <= n; x += 4) {
    dst[d + x] = flipKey(src[s + x]);
    dst[d + x + 1] = flipKey(src[s + x + 1]);
    dst[d + x + 2] = flipKey(src[s + x + 2]);
    dst[d + x + 3] = flipKey(src[s + x + 3]);
  }
  for (; x < n; x++) dst[d + x] = flipKey(src[s + x]);
}

/**
 * Maximum over the (2·radiusPx+1)² square centred on each pixel (window clipped at the image border).
 * The column pass goes block by block (blocks of w = 2r + 1 padded rows): output rows in block b need the suffix
 * maxima h of block b and the prefix maxima g of block b + 1, so only two blocks of row-pass results are kept;
 * everything but the output stays small enough for the cache.
 */
export function maxFilter(plane: Plane, radiusPx: number): Plane {
  const r = Math.max(0, Math.round(radiusPx));
  const { width, height } = plane;
  const out = new Float32Array(width * height);
  if (out.length === 0) return { width, height, data: out };
  // A window reaching past both ends of a line sees the whole line: larger radii change nothing.
  const rx = Math.min(r, width - 1);
  const ry = Math.min(r, height - 1);
  const w = 2 * ry + 1;
  const blocks = Math.ceil((height + 2 * ry) / w);
  const bits = new Int32Array(plane.data.buffer, plane.data.byteOffset, width * height);
  const outBits = new Int32Array(out.buffer);
  const line = { pad: new Int32Array(width + 2 * rx).fill(BELOW_ALL), g: new Int32Array(width + 2 * rx), h: new Int32Array(width + 2 * rx) };
  let cur = new Int32Array(w * width);
  let next = new Int32Array(w * width);
  const g = new Int32Array(w * width);
  const h = new Int32Array(w * width);
  blockOfRows(plane, bits, 0, rx, ry, cur, line);
  for (let b = 0; b * w < height; b++) {
    const y0 = b * w;
    blockScan(cur, h, width, Math.min(w, height + 2 * ry - y0), false);
    const nextCount = Math.min(w, height + 2 * ry - y0 - w);
    if (b + 1 < blocks) {
      blockOfRows(plane, bits, b + 1, rx, ry, next, line);
      blockScan(next, g, width, nextCount, true);
    }
    // Window starting at padded row y = y0 covers block b exactly; later ones end at row y + 2r in block b + 1.
    flipRow(h, 0, outBits, y0 * width, width);
    for (let y = y0 + 1; y < y0 + w && y < height; y++) {
      const o = y * width;
      maxOfRows(h, (y - y0) * width, g, (y - y0 - 1) * width, outBits, o, width);
      flipRow(outBits, o, outBits, o, width);
    }
    [cur, next] = [next, cur];
  }
  return { width, height, data: out };
}

/**
 * Maximum over the (2·radiusPx+1)-pixel window of each row centred on each pixel (clipped at the row ends): the
 * row pass of maxFilter alone, for callers that need the square maximum at a few pixels only (the maximum over a
 * square is the maximum of the row maxima of its rows). `into` (optional, at least width × height long, not the
 * input's own array) receives them instead of a new array; the result is then a view of it.
 */
export function rowMaxima(plane: Plane, radiusPx: number, into?: Float32Array): Float32Array {
  const { width, height } = plane;
  const out = into ? into.subarray(0, width * height) : new Float32Array(width * height);
  if (out.length === 0) return out;
  const r = Math.min(Math.max(0, Math.round(radiusPx)), width - 1);
  const bits = new Int32Array(plane.data.buffer, plane.data.byteOffset, width * height);
  const outBits = new Int32Array(out.buffer, out.byteOffset, width * height);
  const line = { pad: new Int32Array(width + 2 * r).fill(BELOW_ALL), g: new Int32Array(width + 2 * r), h: new Int32Array(width + 2 * r) };
  for (let y = 0; y < height; y++) {
    maxRow(bits, y * width, width, r, outBits, y * width, line);
    flipRow(outBits, y * width, outBits, y * width, width);
  }
  return out;
}

/**
 * rowMaxima at the listed pixels only (indices into the plane's pixels, in any order, each at most once), written to
 * the same places of `into` (at least width × height long; other entries are left as they are). Each value has the
 * same bits as rowMaxima's there: the maximum of the same clipped window, compared on the same integer keys. For
 * callers that need the row maxima near a thin band of pixels only.
 */
export function rowMaximaAt(plane: Plane, radiusPx: number, at: Int32Array, into: Float32Array): void {
  const { width, height } = plane;
  if (width * height === 0) return;
  const r = Math.min(Math.max(0, Math.round(radiusPx)), width - 1);
  const bits = new Int32Array(plane.data.buffer, plane.data.byteOffset, width * height);
  const outBits = new Int32Array(into.buffer, into.byteOffset, width * height);
  windowKeysAt(bits, width, r, at, outBits);
}

/** For each index p of `at`: out[p] = the float bits of the largest key over row p's pixels within r of p. */
function windowKeysAt(bits: Int32Array, width: number, r: number, at: Int32Array, out: Int32Array): void {
  for (let k = 0; k < at.length; k++) {
    const p = at[k];
    const x = p % width;
    const a = p - (x < r ? x : r);
    const b = p + (width - 1 - x < r ? width - 1 - x : r);
    let m = BELOW_ALL;
    for (let i = a; i <= b; i++) m = larger(m, flipKey(bits[i]));
    out[p] = flipKey(m);
  }
}
