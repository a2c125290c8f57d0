// The toolbar: open, tools, axis commands, undo/redo, zoom, export, view tabs and save status. It stays on one line:
// groups that do not fit move into the "More" menu (least used first), and the save status is cut to one short line.
import { useRef, useState } from 'react';
import type { Dispatch } from 'react';
import type { SaveStatus } from '../hooks/useAutosave';
import { useElementSize } from '../hooks/useElementSize';
import { EXPORT_LABELS } from '../hooks/useExports';
import type { ExportCommand } from '../hooks/useExports';
import { canRedo, canUndo } from '../state';
import type { EditorAction, EditorState, ToolName } from '../state';
import { inlineGroups, type ToolbarGroupSize } from '../ui/toolbarFit';
import { MenuButton, type MenuItem } from './MenuButton';

/** The main views. */
export type Tab = 'embryo' | 'time' | 'batch' | 'cohort';

/** Props of the toolbar. */
export interface ToolbarProps {
  readonly state: EditorState;
  readonly dispatch: Dispatch<EditorAction>;
  readonly tab: Tab;
  readonly onTab: (t: Tab) => void;
  readonly onOpenFolder: () => void;
  readonly onOpenProject: () => void;
  readonly onOpenDemo: () => void;
  readonly onFit: () => void;
  readonly onZoom: (factor: number) => void;
  readonly saveStatus: SaveStatus;
  readonly exports: (cmd: ExportCommand) => Promise<void>;
  readonly hasMeasurement: boolean;
  readonly exportMenu: boolean;
  readonly onExportMenu: (open: boolean) => void;
  readonly onHelp: () => void;
}

/** One toolbar button, shown inline or as an entry of the More menu. */
interface Action {
  readonly id: string;
  readonly label: string;
  readonly title: string;
  readonly onClick: () => void;
  readonly disabled?: boolean;
  readonly on?: boolean;
  readonly testId?: string;
}

interface Group extends ToolbarGroupSize { readonly actions: readonly Action[] }

const TOOLS: [ToolName, string, string][] = [['pan', 'Pan', 'H'], ['axis', 'Axis', 'A'], ['landmark', 'Landmark', 'L']];
const TABS: [Tab, string][] = [['embryo', 'Embryo'], ['time', 'Over time'], ['batch', 'Batch'], ['cohort', 'Cohort']];
/** Width of the parts that never collapse (brand, Export, tabs, More, ?, save status, gaps), CSS px. */
const FIXED_PX = 680;

/** Save status text: one short line (the full error is in the message bar and the tooltip). */
function saveText(s: SaveStatus): string {
  switch (s.kind) {
    case 'idle': return '';
    case 'pending': return 'saving…';
    case 'saved': return `saved ${new Date(s.at).toLocaleTimeString()}`;
    case 'error': return 'not saved ⚠';
  }
}

function groups(p: ToolbarProps): Group[] {
  const { state, dispatch } = p;
  const g = (id: string, collapseRank: number, actions: Action[]): Group => ({ id, collapseRank, actions, labels: actions.map((a) => a.label) });
  return [
    g('open', 3, [
      { id: 'open-folder', label: 'Open folder…', title: 'Open a folder of stacks (its project is opened with it)', onClick: p.onOpenFolder },
      { id: 'open-project', label: 'Open project…', title: 'Open a project file', onClick: p.onOpenProject },
      { id: 'demo', label: 'Demo', title: 'Open the synthetic demo embryos', onClick: p.onOpenDemo },
    ]),
    g('tools', 5, TOOLS.map(([t, label, key]) => ({ id: `tool-${t}`, label, title: `${label} tool (${key})`, on: state.tool === t, testId: `tool-${t}`, onClick: () => dispatch({ type: 'setTool', tool: t }) }))),
    g('axis', 2, [
      { id: 'swap', label: 'Swap A↔P', title: 'Swap anterior and posterior (S)', testId: 'swap', onClick: () => dispatch({ type: 'swapPoles' }) },
      { id: 'auto-axis', label: 'Auto axis', title: 'Back to the automatic axis', testId: 'auto-axis', onClick: () => dispatch({ type: 'resetAxis' }) },
    ]),
    g('history', 4, [
      { id: 'undo', label: 'Undo', title: 'Undo the last edit of this file, the settings or the comparison options (Ctrl+Z)', testId: 'undo', disabled: !canUndo(state), onClick: () => dispatch({ type: 'undo' }) },
      { id: 'redo', label: 'Redo', title: 'Redo (Ctrl+Shift+Z)', testId: 'redo', disabled: !canRedo(state), onClick: () => dispatch({ type: 'redo' }) },
    ]),
    g('view', 1, [
      { id: 'fit', label: 'Fit', title: 'Fit the image to the window (F)', testId: 'fit-view', onClick: p.onFit },
      { id: 'zoom-out', label: '−', title: 'Zoom out (−)', onClick: () => p.onZoom(0.8) },
      { id: 'zoom-in', label: '+', title: 'Zoom in (+)', onClick: () => p.onZoom(1.25) },
    ]),
  ];
}

/** The toolbar. */
export function Toolbar(p: ToolbarProps) {
  const bar = useRef<HTMLElement>(null);
  const { width } = useElementSize(bar);
  const [more, setMore] = useState(false);
  const all = groups(p);
  // Before the first measurement everything is inline; the width then decides.
  const inline = width === 0 ? new Set(all.map((g) => g.id)) : inlineGroups(all, width - FIXED_PX);
  const hidden = all.filter((g) => !inline.has(g.id));
  const moreItems: MenuItem[] = hidden.flatMap((g) => g.actions.map((a) => ({
    id: a.id, label: a.label, title: a.title, onSelect: a.onClick, disabled: a.disabled, testId: a.testId, checked: a.on,
  })));
  const exportItems: MenuItem[] = (Object.keys(EXPORT_LABELS) as ExportCommand[]).map((c) => ({ id: c, label: EXPORT_LABELS[c], onSelect: () => { void p.exports(c); } }));
  const save = p.saveStatus;
  return (
    <header className="toolbar" ref={bar} data-testid="toolbar">
      <span className="brand">Eggline</span>
      {all.filter((g) => inline.has(g.id)).map((g) => (
        <div key={g.id} className="tool-group" role="group" data-group={g.id}>
          {g.actions.map((a) => (
            <button key={a.id} className={a.on ? 'on' : ''} aria-pressed={a.on} title={a.title} data-testid={a.testId} disabled={a.disabled} onClick={a.onClick}>{a.label}</button>
          ))}
          {g.id === 'view' && <span className="zoom" title="zoom">{Math.round(p.state.view.zoom * 100)}%</span>}
        </div>
      ))}
      <MenuButton label="Export ▾" items={exportItems} open={p.exportMenu} onOpen={p.onExportMenu} disabled={!p.hasMeasurement} testId="export" />
      {hidden.length > 0 && <MenuButton label="More ▾" items={moreItems} open={more} onOpen={setMore} testId="toolbar-more" title="Commands that do not fit on the toolbar" />}
      <nav className="tabs" role="tablist" aria-label="views">
        {TABS.map(([t, label]) => <button key={t} role="tab" aria-selected={p.tab === t} className={p.tab === t ? 'on' : ''} data-testid={`tab-${t}`} onClick={() => p.onTab(t)}>{label}</button>)}
      </nav>
      <button title="Keys and gestures (F1)" aria-label="help: keys and gestures" onClick={p.onHelp}>?</button>
      <span className={`save-status ${save.kind}`} data-testid="save-status" title={save.kind === 'error' ? save.message : undefined}>{saveText(save)}</span>
    </header>
  );
}
