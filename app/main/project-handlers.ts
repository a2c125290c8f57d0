// Saving the project the renderer edits.
import { saveProject as saveProjectFile } from '../project';
import { requireAllowed, requireProjectDoc } from './args';
import type { ShellContext } from './context';
import { ApiFailure } from './result';

/** Validate and save the project atomically (previous version kept as .bak); only project paths we handed out. */
export async function saveProject(ctx: ShellContext, pathArg: unknown, docArg: unknown): Promise<{ savedAt: string }> {
  const projectPath = requireAllowed(ctx.allow, 'project', pathArg, 'projectPath');
  const doc = requireProjectDoc(docArg);
  if (doc.folder !== null && !ctx.allow.isAllowed('read', doc.folder)) {
    throw new ApiFailure('not-allowed', `project: folder ${doc.folder} was not opened`);
  }
  await saveProjectFile(projectPath, doc);
  return { savedAt: new Date().toISOString() };
}
