// Loading stacks for viewing: the projected channels with detection, and single raw slices for the Z slider.
import { promises as fs } from 'node:fs';
import { isStackFolderName } from '../../core/batch';
import type { LoadedStack, SliceRequest, StackPreview, StackTimeOptions } from '../../core/contract';
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

/** Checked time options of a load (absent or null: none), or a 'bad-argument' failure naming the field. */
export function requireTimeOptions(value: unknown): StackTimeOptions | null {
  if (value === undefined || value === null) return null;
  if (typeof value !== 'object') throw new ApiFailure('bad-argument', 'time must be {timeStepS, axisPerTime} or null');
  const o = value as Record<string, unknown>;
  const step = o.timeStepS;
  if (!(step === null || (typeof step === 'number' && Number.isFinite(step) && step > 0))) {
    throw new ApiFailure('bad-argument', 'time.timeStepS must be a positive number of seconds or null');
  }
  if (typeof o.axisPerTime !== 'boolean') throw new ApiFailure('bad-argument', 'time.axisPerTime must be true or false');
  return { timeStepS: step, axisPerTime: o.axisPerTime };
}

/**
 * Read, project and detect one allowed stack, off the main thread when the app provides a runner. A load with time
 * options stops one still under way (the window moved on to another time point or file): that one fails 'cancelled'.
 */
export async function loadStack(ctx: ShellContext, pathArg: unknown, settingsArg: unknown, timeArg?: unknown): Promise<LoadedStack> {
  const path = requireAllowed(ctx.allow, 'read', pathArg, 'path');
  const settings = requireSettings(settingsArg);
  const time = requireTimeOptions(timeArg);
  await requireFile(path);
  const controller = new AbortController();
  if (time !== null) {
    for (const c of ctx.viewLoads) c.abort();
    ctx.viewLoads.add(controller);
  }
  const run = ctx.deps.runAnalysisOffThread ?? ctx.engine.loadForView.bind(ctx.engine);
  try {
    const view = await run(path, labelOf(path), settings, time, time === null ? null : controller.signal);
    if (controller.signal.aborted) throw new ApiFailure('cancelled', `${labelOf(path)}: loading cancelled (another view was asked for)`);
    return { path, info: view.info, projected: view.projected, detection: view.detection };
  } catch (e) {
    if (controller.signal.aborted) throw new ApiFailure('cancelled', `${labelOf(path)}: loading cancelled (another view was asked for)`);
    throw e;
  } finally {
    ctx.viewLoads.delete(controller);
  }
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
