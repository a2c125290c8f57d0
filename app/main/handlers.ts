// The renderer↔app API as plain functions (no electron import), so tests and the browser harness can call them.
import type { BatchProgress, EgglineApi, ExportKind } from '../../core/contract';

/** Native dialogs and other shell services the handlers need; main.ts supplies electron-backed versions. */
export interface HandlerDeps {
  /** Folder for app data: demo set, recent list. */
  readonly dataDir: string;
  readonly dialogs: {
    chooseFolder(): Promise<string | null>;
    chooseFiles(): Promise<string[] | null>;
    chooseOutputFolder(): Promise<string | null>;
    openProjectFile(): Promise<string | null>;
    saveFile(suggestedName: string, kind: ExportKind): Promise<string | null>;
  };
  /** Push batch progress to the renderer. */
  emitBatchProgress(p: BatchProgress): void;
}

/** Every API method except the two event subscriptions (those live in the preload). */
export type ApiHandlers = Omit<EgglineApi, 'onBatchProgress' | 'onMenuCommand'>;

const notReady = async () => ({ ok: false as const, error: { code: 'internal' as const, message: 'not ready' } });

/** Build the API handlers over the given shell services. */
export function createHandlers(_deps: HandlerDeps): ApiHandlers {
  return {
    openDemo: notReady, chooseFolder: notReady, chooseFiles: notReady, openDropped: notReady, recent: notReady,
    loadStack: notReady, loadSlice: notReady, saveProject: notReady, openProject: notReady, runBatch: notReady,
    cancelBatch: notReady, chooseOutputFolder: notReady, exportFile: notReady, svgToPng: notReady,
  };
}
