// Public surface of app/project: project files (versioned JSON, atomic save with backup) and their validation.
export {
  ProjectFormatError, PROJECT_SCHEMA, PROJECT_VERSION, checkProjectDoc, checkFileEdits, checkSettings, checkRangeEl,
} from '../../core/settings';
export { writeFileAtomic, type AtomicWriteOptions } from './atomic-write';
export {
  loadProject, loadProjectOrBackup, cleanInterruptedSaves, type LoadedProject, saveProject, serializeProject, projectKeyFor, pathForProjectKey, toPortablePath, MAX_PROJECT_BYTES,
} from './project-file';
export { newProject, PROJECT_FILE_NAME } from './new-project';
