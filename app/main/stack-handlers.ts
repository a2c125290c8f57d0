// Loading stacks for viewing: the projected channels with detection, and single raw slices for the Z slider.
import { promises as fs } from 'node:fs';
import { isStackFolderName } from '../../core/batch';
import type { LoadedStack, SliceRequest, StackPreview } from '../../core/contract';
import { requireAllowed, requireInt, requireSettings } from './args';
import type { ShellContext } from './context';
import type { SliceData } from '../engine/engine';
import { ApiFailure, labelOf } from './result';

/** Largest plane index accepted in a slice request (far above any real stack). */
const MAX_INDEX = 1_000_000;

/** A readable file or OME-Zarr folder (*.zarr), or a failure naming it. */
async function requireFile(path: string): Promise<void> {
  const stat = await fs.stat(path);
  if (stat.isDirectory() && isStackFolderName(labelOf(path))) return;
  if (!stat.isFile()) throw new ApiFailure('bad-argument', `${labelOf(path)}: is not a file`);
}

/** Read, project and detect one allowed stack, off the main thread when the app provides a runner. */
export async function loadStack(ctx: ShellContext, pathArg: unknown, settingsArg: unknown): Promise<LoadedStack> {
  const path = requireAllowed(ctx.allow, 'read', pathArg, 'path');
  const settings = requireSettings(settingsArg);
  await requireFile(path);
  const run = ctx.deps.runAnalysisOffThread ?? ctx.engine.loadForView.bind(ctx.engine);
  const view = await run(path, labelOf(path), settings);
  return { path, info: view.info, projected: view.projected, detection: view.detection };
}

/** The middle slice of the first channel of an allowed stack, shown while loadStack runs. */
export async function loadPreview(ctx: ShellContext, pathArg: unknown): Promise<StackPreview> {
  const path = requireAllowed(ctx.allow, 'read', pathArg, 'path');
  await requireFile(path);
  const read = ctx.deps.readPreviewOffThread ?? ctx.engine.readPreview?.bind(ctx.engine);
  if (read === undefined) throw new ApiFailure('bad-argument', `${labelOf(path)}: no preview in this build`);
  return read(path, labelOf(path));
}

/** Decode one slice (z, c, t) of an allowed stack as floats. */
export async function loadSlice(ctx: ShellContext, reqArg: unknown): Promise<SliceData> {
  if (typeof reqArg !== 'object' || reqArg === null) throw new ApiFailure('bad-argument', 'request must be {path, z, c, t}');
  const req = reqArg as Partial<Record<keyof SliceRequest, unknown>>;
  const path = requireAllowed(ctx.allow, 'read', req.path, 'path');
  const z = requireInt(req.z, 'z', 0, MAX_INDEX);
  const c = requireInt(req.c, 'c', 0, MAX_INDEX);
  const t = requireInt(req.t, 't', 0, MAX_INDEX);
  await requireFile(path);
  const read = ctx.deps.readSliceOffThread ?? ctx.engine.readSlice.bind(ctx.engine);
  return read(path, labelOf(path), z, c, t);
}
