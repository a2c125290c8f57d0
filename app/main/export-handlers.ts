// Exports through the save dialog, and SVG → PNG rendering with sharp.
import sharp from 'sharp';
import type { ExportKind } from '../../core/contract';
import { writeFileAtomic } from '../project';
import { requireText } from './args';
import type { ShellContext } from './context';
import { ApiFailure } from './result';

const KINDS: readonly ExportKind[] = ['svg', 'png', 'csv', 'json'];
/** Largest export accepted, bytes or characters. */
export const MAX_EXPORT_SIZE = 512 * 1024 * 1024;
/** Largest SVG rendered, characters. */
export const MAX_SVG_CHARS = 32 * 1024 * 1024;
/** Allowed PNG scale factors (1 = 72 dpi, i.e. one SVG user unit per pixel). */
export const SCALE_RANGE = [0.1, 8] as const;

/** Check the export arguments: known kind, plain file name, text for svg/csv/json and bytes for png. */
function checkExport(kindArg: unknown, nameArg: unknown, content: unknown): { kind: ExportKind; name: string } {
  if (!KINDS.includes(kindArg as ExportKind)) throw new ApiFailure('bad-argument', `kind must be one of ${KINDS.join(', ')}`);
  const kind = kindArg as ExportKind;
  const name = requireText(nameArg, 'suggestedName', 200);
  if (/[\\/\0]/.test(name)) throw new ApiFailure('bad-argument', 'suggestedName must be a file name, not a path');
  const isBytes = content instanceof Uint8Array;
  if (kind === 'png' ? !isBytes : typeof content !== 'string') {
    throw new ApiFailure('bad-argument', `content must be ${kind === 'png' ? 'bytes (Uint8Array)' : 'text'} for ${kind}`);
  }
  if ((content as string | Uint8Array).length > MAX_EXPORT_SIZE) throw new ApiFailure('bad-argument', 'content is too large to export');
  return { kind, name };
}

/** Ask where to save, then write the content there; null when the user cancels. */
export async function exportFile(ctx: ShellContext, kindArg: unknown, nameArg: unknown, content: unknown): Promise<string | null> {
  const { kind, name } = checkExport(kindArg, nameArg, content);
  const chosen = await ctx.deps.dialogs.saveFile(name, kind);
  if (chosen === null) return null;
  const path = chosen.toLowerCase().endsWith(`.${kind}`) ? chosen : `${chosen}.${kind}`;
  await writeFileAtomic(path, content as string | Uint8Array);
  return path;
}

/** Render an SVG string to PNG bytes; `scale` 2 gives twice the SVG's pixel size (density 144 dpi). */
export async function svgToPng(svgArg: unknown, scaleArg: unknown): Promise<Uint8Array> {
  if (typeof svgArg !== 'string' || svgArg.length > MAX_SVG_CHARS || !svgArg.includes('<svg')) {
    throw new ApiFailure('bad-argument', 'svg must be an SVG document as text');
  }
  const scale = scaleArg;
  if (typeof scale !== 'number' || !Number.isFinite(scale) || scale < SCALE_RANGE[0] || scale > SCALE_RANGE[1]) {
    throw new ApiFailure('bad-argument', `scale must be a number from ${SCALE_RANGE[0]} to ${SCALE_RANGE[1]}`);
  }
  try {
    const png = await sharp(Buffer.from(svgArg, 'utf8'), { density: 72 * scale }).png().toBuffer();
    return new Uint8Array(png);
  } catch (e) {
    throw new ApiFailure('bad-argument', `svg could not be rendered (${(e as Error).message})`);
  }
}
