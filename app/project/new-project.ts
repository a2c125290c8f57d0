// A fresh project for a folder that has none yet.
import { DEFAULT_SETTINGS, PROJECT_SCHEMA, PROJECT_VERSION, type ProjectDoc } from '../../core/settings';

/** The file name a folder's project gets. */
export const PROJECT_FILE_NAME = 'eggline-project.json';

/** An empty project for `folder` (absolute or null) with the default settings. */
export function newProject(folder: string | null): ProjectDoc {
  return { schema: PROJECT_SCHEMA, version: PROJECT_VERSION, folder, settings: DEFAULT_SETTINGS, files: {} };
}
