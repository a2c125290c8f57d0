// The application menu as plain data; each item sends a command string to the renderer, which decides what it does.
import { basename } from 'node:path';
import { MENU_OPEN_RECENT_PREFIX, type MenuCommand } from '../../core/contract';

/** One menu item (a structural subset of Electron's MenuItemConstructorOptions). */
export interface MenuItemSpec {
  readonly label?: string;
  readonly role?: string;
  readonly type?: 'separator' | 'submenu';
  readonly accelerator?: string;
  readonly enabled?: boolean;
  readonly click?: () => void;
  readonly submenu?: readonly MenuItemSpec[];
}

/** The recent submenu: one item per path, newest first. */
function recentItems(recent: readonly string[], send: (command: string) => void): MenuItemSpec[] {
  if (recent.length === 0) return [{ label: 'No recent items', enabled: false }];
  return recent.map((path) => ({ label: `${basename(path)} — ${path}`, click: () => send(`${MENU_OPEN_RECENT_PREFIX}${path}`) }));
}

/** Build the menu template. `isMac` adds the app menu that macOS expects; `about` shows the About box (main side). */
export function buildMenuTemplate(send: (command: string) => void, recent: readonly string[], isMac: boolean, about: () => void = () => undefined): MenuItemSpec[] {
  const item = (label: string, command: MenuCommand, accelerator?: string): MenuItemSpec =>
    ({ label, click: () => send(command), ...(accelerator === undefined ? {} : { accelerator }) });
  const sep: MenuItemSpec = { type: 'separator' };
  const template: MenuItemSpec[] = [
    { label: 'File', submenu: [
      item('Open Folder…', 'open-folder', 'CmdOrCtrl+O'), item('Open Files…', 'open-files'),
      item('Open Project…', 'open-project'), item('Open Demo Data', 'open-demo'), { label: 'Recent', submenu: recentItems(recent, send) }, sep,
      item('Save', 'save', 'CmdOrCtrl+S'), item('Export…', 'export'), sep, { role: isMac ? 'close' : 'quit' },
    ] },
    { label: 'Edit', submenu: [
      item('Undo', 'undo', 'CmdOrCtrl+Z'), item('Redo', 'redo', 'CmdOrCtrl+Shift+Z'), sep,
      { role: 'cut' }, { role: 'copy' }, { role: 'paste' }, { role: 'selectAll' },
    ] },
    { label: 'View', submenu: [
      item('Fit to Window', 'fit-to-window', 'CmdOrCtrl+0'), item('Zoom In', 'zoom-in', 'CmdOrCtrl+='),
      item('Zoom Out', 'zoom-out', 'CmdOrCtrl+-'), sep, item('Swap Anterior/Posterior', 'swap-poles'),
    ] },
    { label: 'Help', submenu: [item('Eggline Help', 'show-help', 'F1'), { label: 'About Eggline', click: about }] },
  ];
  return isMac ? [{ label: 'Eggline', submenu: [{ role: 'about' }, sep, { role: 'hide' }, { role: 'quit' }] }, ...template] : template;
}
