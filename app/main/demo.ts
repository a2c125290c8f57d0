// The built-in demo data: written once into <dataDir>/demo, then opened like any folder.
import { promises as fs } from 'node:fs';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import type { OpenedFolder } from '../../core/contract';
import type { ShellContext } from './context';
import { openFolder } from './open-handlers';

/** The demo folder inside the app's data folder. */
export function demoFolder(dataDir: string): string {
  return join(dataDir, 'demo');
}

/** Write the demo set unless it is there. It is written to a temp folder and renamed, so a crash never leaves half. */
export async function ensureDemoData(ctx: ShellContext): Promise<string> {
  const dir = demoFolder(ctx.deps.dataDir);
  if (await fs.stat(dir).then((s) => s.isDirectory(), () => false)) return dir;
  await fs.mkdir(ctx.deps.dataDir, { recursive: true });
  const tmp = `${dir}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`;
  try {
    await ctx.engine.writeDemoDataSet(tmp, ctx.deps.demoSubset === undefined ? {} : { subset: ctx.deps.demoSubset });
    await fs.rename(tmp, dir);
  } catch (e) {
    await fs.rm(tmp, { recursive: true, force: true });
    // Another call may have finished first; its folder is as good as ours.
    if (await fs.stat(dir).then((s) => s.isDirectory(), () => false)) return dir;
    throw e;
  }
  return dir;
}

/** Write (once) and open the demo folder with its project file. */
export async function openDemo(ctx: ShellContext): Promise<OpenedFolder> {
  return openFolder(ctx, await ensureDemoData(ctx));
}
