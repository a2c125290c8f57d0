// The toolbar: open, tools, axis commands, undo/redo, zoom, export, view tabs and save status.
import type { Dispatch } from 'react';
import type { SaveStatus } from '../hooks/useAutosave';
import { EXPORT_LABELS } from '../hooks/useExports';
import type { ExportCommand } from '../hooks/useExports';
import { canRedo, canUndo } from '../state';
import type { EditorAction, EditorState, ToolName } from '../state';

/** Props of the toolbar. */
export interface ToolbarProps {
  readonly state: EditorState;
  readonly dispatch: Dispatch<EditorAction>;
  readonly tab: 'embryo' | 'batch' | 'cohort';
  readonly onTab: (t: 'embryo' | 'batch' | 'cohort') => void;
  readonly onOpenFolder: () => void;
  readonly onOpenProject: () => void;
  readonly onOpenDemo: () => void;
  readonly onFit: () => void;
  readonly saveStatus: SaveStatus;
  readonly exports: (cmd: ExportCommand) => Promise<void>;
  readonly hasMeasurement: boolean;
  readonly exportMenu: boolean;
  readonly onExportMenu: (open: boolean) => void;
  readonly onHelp: () => void;
}

const TOOLS: [ToolName, string, string][] = [['pan', 'Pan', 'H'], ['axis', 'Axis', 'A'], ['landmark', 'Landmark', 'L']];

/** Save status text. */
function saveText(s: SaveStatus): string {
  switch (s.kind) {
    case 'idle': return '';
    case 'pending': return 'saving…';
    case 'saved': return `saved ${new Date(s.at).toLocaleTimeString()}`;
    case 'error': return `not saved: ${s.message}`;
  }
}

/** The toolbar. */
export function Toolbar(p: ToolbarProps) {
  const menu = p.exportMenu;
  const setMenu = p.onExportMenu;
  const { state, dispatch } = p;
  return (
    <header className="toolbar">
      <span className="brand">Eggline</span>
      <button onClick={p.onOpenFolder}>Open folder…</button>
      <button onClick={p.onOpenProject}>Open project…</button>
      <button onClick={p.onOpenDemo} title="Open the synthetic demo embryos">Demo</button>
      <span className="sep" />
      {TOOLS.map(([t, label, key]) => (
        <button key={t} className={state.tool === t ? 'on' : ''} data-testid={`tool-${t}`} title={`${label} tool (${key})`} onClick={() => dispatch({ type: 'setTool', tool: t })}>{label}</button>
      ))}
      <button data-testid="swap" title="Swap anterior and posterior (S)" onClick={() => dispatch({ type: 'swapPoles' })}>Swap A↔P</button>
      <button title="Back to the automatic axis" onClick={() => dispatch({ type: 'resetAxis' })}>Auto axis</button>
      <span className="sep" />
      <button data-testid="undo" disabled={!canUndo(state)} title="Undo the last edit of this file or the settings (Ctrl+Z)" onClick={() => dispatch({ type: 'undo' })}>Undo</button>
      <button data-testid="redo" disabled={!canRedo(state)} title="Redo (Ctrl+Shift+Z)" onClick={() => dispatch({ type: 'redo' })}>Redo</button>
      <span className="sep" />
      <button title="Fit to window (F)" onClick={p.onFit}>Fit</button>
      <span className="zoom">{Math.round(state.view.zoom * 100)}%</span>
      <span className="sep" />
      <div className="menu">
        <button disabled={!p.hasMeasurement} onClick={() => setMenu(!menu)} data-testid="export">Export ▾</button>
        {menu && (
          <ul className="menu-list" onMouseLeave={() => setMenu(false)}>
            {(Object.keys(EXPORT_LABELS) as ExportCommand[]).map((c) => (
              <li key={c}><button onClick={() => { setMenu(false); void p.exports(c); }}>{EXPORT_LABELS[c]}</button></li>
            ))}
          </ul>
        )}
      </div>
      <nav className="tabs">
        {(['embryo', 'batch', 'cohort'] as const).map((t) => <button key={t} className={p.tab === t ? 'on' : ''} data-testid={`tab-${t}`} onClick={() => p.onTab(t)}>{t}</button>)}
      </nav>
      <button title="Keys and gestures (F1)" onClick={p.onHelp}>?</button>
      <span className={`save-status ${p.saveStatus.kind}`} data-testid="save-status">{saveText(p.saveStatus)}</span>
    </header>
  );
}
