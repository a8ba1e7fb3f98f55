// The application menu as data (File, Edit, View, Window, Help) with its keyboard shortcuts; items that the page acts on
// carry a MenuCommand, turned into a click that sends it. Accelerators use Electron's CmdOrCtrl (Cmd on macOS, Ctrl elsewhere).
import { basename, dirname } from 'node:path';
import type { MenuCommand, RecentProject } from '../../core/contract';

export type MenuRole =
  | 'appMenu' | 'windowMenu' | 'about' | 'quit' | 'close'
  | 'undo' | 'redo' | 'cut' | 'copy' | 'paste' | 'delete' | 'selectAll'
  | 'resetZoom' | 'zoomIn' | 'zoomOut' | 'togglefullscreen' | 'reload' | 'toggleDevTools';

/** One menu item as data: a command for the page, a built-in role, a separator, or a submenu. */
export interface MenuItemSpec {
  label?: string;
  accelerator?: string;
  role?: MenuRole;
  type?: 'separator';
  enabled?: boolean;
  command?: MenuCommand;
  submenu?: MenuItemSpec[];
}

export interface MenuOptions {
  /** process.platform: macOS gets the application menu and the Window menu. */
  platform: string;
  appName: string;
  recentProjects: readonly RecentProject[];
  /** Adds Reload and Developer Tools to View (when not packaged). */
  developerTools: boolean;
}

const separator: MenuItemSpec = { type: 'separator' };

function recentSubmenu(recentProjects: readonly RecentProject[]): MenuItemSpec[] {
  if (recentProjects.length === 0) return [{ label: 'No recent projects', enabled: false }];
  return recentProjects.map((project) => ({
    label: `${project.name || basename(project.path)}  (${dirname(project.path)})`,
    command: { command: 'open-recent-project', path: project.path },
  }));
}

export function applicationMenuSpec(options: MenuOptions): MenuItemSpec[] {
  const mac = options.platform === 'darwin';
  const file: MenuItemSpec = {
    label: '&File',
    submenu: [
      { label: 'New project', accelerator: 'CmdOrCtrl+N', command: { command: 'new-project' } },
      { label: 'Open recording…', accelerator: 'CmdOrCtrl+O', command: { command: 'open-recording' } },
      { label: 'Open deployment…', accelerator: 'CmdOrCtrl+Shift+D', command: { command: 'open-deployment' } },
      { label: 'Open array…', accelerator: 'CmdOrCtrl+Shift+A', command: { command: 'open-array' } },
      { label: 'Open project…', accelerator: 'CmdOrCtrl+Shift+O', command: { command: 'open-project' } },
      { label: 'Open recent', submenu: recentSubmenu(options.recentProjects) },
      separator,
      { label: 'Save', accelerator: 'CmdOrCtrl+S', command: { command: 'save-project' } },
      { label: 'Save as…', accelerator: 'CmdOrCtrl+Shift+S', command: { command: 'save-project-as' } },
      { label: 'Export log…', accelerator: 'CmdOrCtrl+E', command: { command: 'export-log' } },
      separator,
      mac ? { role: 'close', label: 'Close window', accelerator: 'CmdOrCtrl+W' } : { role: 'quit', label: 'Quit', accelerator: 'Ctrl+Q' },
    ],
  };
  const edit: MenuItemSpec = {
    label: '&Edit',
    submenu: [
      { role: 'undo', accelerator: 'CmdOrCtrl+Z' },
      { role: 'redo', accelerator: mac ? 'Cmd+Shift+Z' : 'Ctrl+Y' },
      separator,
      { role: 'cut', accelerator: 'CmdOrCtrl+X' },
      { role: 'copy', accelerator: 'CmdOrCtrl+C' },
      { role: 'paste', accelerator: 'CmdOrCtrl+V' },
      { role: 'selectAll', accelerator: 'CmdOrCtrl+A' },
    ],
  };
  const view: MenuItemSpec = {
    label: '&View',
    submenu: [
      { role: 'resetZoom', label: 'Actual size', accelerator: 'CmdOrCtrl+0' },
      { role: 'zoomIn', label: 'Zoom in', accelerator: 'CmdOrCtrl+=' },
      { role: 'zoomOut', label: 'Zoom out', accelerator: 'CmdOrCtrl+-' },
      separator,
      { role: 'togglefullscreen', label: 'Full screen', accelerator: mac ? 'Ctrl+Cmd+F' : 'F11' },
      ...(options.developerTools ? [separator, { role: 'reload', accelerator: 'CmdOrCtrl+R' } as MenuItemSpec, { role: 'toggleDevTools', accelerator: mac ? 'Alt+Cmd+I' : 'Ctrl+Shift+I' } as MenuItemSpec] : []),
    ],
  };
  const help: MenuItemSpec = {
    label: '&Help',
    submenu: [
      { label: `About ${options.appName}`, command: { command: 'show-about' } },
      { label: 'Cautions: what a fix can and cannot tell you', command: { command: 'show-cautions' } },
      separator,
      { label: 'Open the demo', command: { command: 'open-demo' } },
    ],
  };
  return mac
    ? [{ label: options.appName, role: 'appMenu' }, file, edit, view, { role: 'windowMenu' }, help]
    : [file, edit, view, help];
}

/** Every accelerator in the menu with the item it triggers, depth first. */
export function menuAccelerators(spec: readonly MenuItemSpec[]): { accelerator: string; label: string }[] {
  return spec.flatMap((item) => [
    ...(item.accelerator === undefined ? [] : [{ accelerator: item.accelerator, label: item.label ?? item.role ?? '' }]),
    ...menuAccelerators(item.submenu ?? []),
  ]);
}

/** The shape Electron's Menu.buildFromTemplate takes (a subset of MenuItemConstructorOptions). */
export interface ElectronMenuItem {
  label?: string;
  accelerator?: string;
  role?: MenuRole;
  type?: 'separator' | 'submenu' | 'normal';
  enabled?: boolean;
  click?: () => void;
  submenu?: ElectronMenuItem[];
}

/** Turns the data into Electron's template: each command becomes a click that sends it to the page. */
export function toElectronTemplate(spec: readonly MenuItemSpec[], sendCommand: (command: MenuCommand) => void): ElectronMenuItem[] {
  return spec.map((item) => {
    const { command, submenu, ...rest } = item;
    const result: ElectronMenuItem = { ...rest };
    if (command !== undefined) result.click = () => sendCommand(command);
    if (submenu !== undefined) result.submenu = toElectronTemplate(submenu, sendCommand);
    return result;
  });
}
