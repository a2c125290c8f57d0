// Native dialogs behind the HandlerDeps.dialogs interface (Electron's dialog module is passed in).
import type { ExportKind } from '../../core/contract';
import type { HandlerDeps } from './context';

/** The parts of Electron's dialog module we use. */
export interface DialogModuleLike {
  showOpenDialog(options: Record<string, unknown>): Promise<{ canceled: boolean; filePaths: string[] }>;
  showSaveDialog(options: Record<string, unknown>): Promise<{ canceled: boolean; filePath?: string }>;
}

const STACK_FILTER = { name: 'TIFF stacks', extensions: ['tif', 'tiff', 'btf', 'tf8', 'tf2'] };
const EXPORT_FILTERS: Readonly<Record<ExportKind, { name: string; extensions: string[] }>> = {
  svg: { name: 'SVG figure', extensions: ['svg'] },
  png: { name: 'PNG image', extensions: ['png'] },
  csv: { name: 'CSV table', extensions: ['csv'] },
  json: { name: 'JSON', extensions: ['json'] },
};

/** Dialogs for the handlers; `dialog` is Electron's dialog module. */
export function createDialogs(dialog: DialogModuleLike): HandlerDeps['dialogs'] {
  const open = async (options: Record<string, unknown>): Promise<string[] | null> => {
    const r = await dialog.showOpenDialog(options);
    return r.canceled || r.filePaths.length === 0 ? null : r.filePaths;
  };
  return {
    chooseFolder: async () => (await open({ title: 'Open a folder of stacks', properties: ['openDirectory'] }))?.[0] ?? null,
    chooseFiles: () => open({ title: 'Open stacks', properties: ['openFile', 'multiSelections'], filters: [STACK_FILTER] }),
    chooseOutputFolder: async () => (await open({ title: 'Choose the output folder', properties: ['openDirectory', 'createDirectory'] }))?.[0] ?? null,
    openProjectFile: async () => (await open({ title: 'Open a project', properties: ['openFile'], filters: [{ name: 'Eggline project', extensions: ['json'] }] }))?.[0] ?? null,
    saveFile: async (suggestedName: string, kind: ExportKind) => {
      const r = await dialog.showSaveDialog({ title: 'Export', defaultPath: suggestedName, filters: [EXPORT_FILTERS[kind]] });
      return r.canceled || r.filePath === undefined || r.filePath === '' ? null : r.filePath;
    },
  };
}
