import { describe, expect, it } from 'vitest';
import { MENU_COMMANDS, type MenuCommand, type RecentProject } from '../../../core/contract';
import { applicationMenuSpec, menuAccelerators, toElectronTemplate, type MenuItemSpec } from '../../../main/electron/menu';

const recent: RecentProject[] = [
  { path: '/surveys/pond.whence', name: 'Pond', openedAtIso: '2024-05-14T22:00:00.000Z' },
  { path: '/surveys/hedge.whence', name: 'Hedgerow', openedAtIso: '2024-05-13T22:00:00.000Z' },
];
const options = (platform: string, developerTools = false) => ({ platform, appName: 'Whence', recentProjects: recent, developerTools });

function find(spec: readonly MenuItemSpec[], label: string): MenuItemSpec | undefined {
  for (const item of spec) {
    if (item.label === label) return item;
    const inner = find(item.submenu ?? [], label);
    if (inner !== undefined) return inner;
  }
  return undefined;
}

function commands(spec: readonly MenuItemSpec[]): MenuCommand[] {
  return spec.flatMap((item) => [...(item.command ? [item.command] : []), ...commands(item.submenu ?? [])]);
}

describe('applicationMenuSpec()', () => {
  // Expected values: the menu this project specifies; Ctrl/Cmd+O, Ctrl/Cmd+S, Ctrl/Cmd+Shift+S and the macOS app menu are desktop conventions, common practice.
  it('gives File its shortcuts: Open recording Ctrl/Cmd+O, Open deployment Ctrl/Cmd+Shift+D and Save Ctrl/Cmd+S', () => {
    const spec = applicationMenuSpec(options('linux'));
    expect(find(spec, 'Open recording…')).toMatchObject({ accelerator: 'CmdOrCtrl+O', command: { command: 'open-recording' } });
    expect(find(spec, 'Save')).toMatchObject({ accelerator: 'CmdOrCtrl+S', command: { command: 'save-project' } });
    expect(find(spec, 'Save as…')).toMatchObject({ accelerator: 'CmdOrCtrl+Shift+S', command: { command: 'save-project-as' } });
    expect(find(spec, 'Open deployment…')).toMatchObject({ accelerator: 'CmdOrCtrl+Shift+D', command: { command: 'open-deployment' } });
    expect(find(spec, 'Open array…')?.command).toEqual({ command: 'open-array' });
    expect(find(spec, 'Open project…')?.command).toEqual({ command: 'open-project' });
    expect(find(spec, 'Export log…')?.command).toEqual({ command: 'export-log' });
  });

  it('has the View zoom items and Help About and cautions', () => {
    const spec = applicationMenuSpec(options('win32'));
    const view = spec.find((item) => item.label === '&View')!;
    expect(view.submenu!.map((item) => item.role).filter(Boolean)).toEqual(['resetZoom', 'zoomIn', 'zoomOut', 'togglefullscreen']);
    expect(find(spec, 'About Whence')?.command).toEqual({ command: 'show-about' });
    expect(commands(spec)).toContainEqual({ command: 'show-cautions' });
  });

  it('offers every menu command of the contract, on every platform', () => {
    for (const platform of ['darwin', 'win32', 'linux']) {
      const offered = new Set(commands(applicationMenuSpec(options(platform))).map((command) => command.command));
      for (const command of MENU_COMMANDS) expect(offered.has(command), `${platform}: ${command}`).toBe(true);
    }
  });

  it('never gives two items one shortcut', () => {
    for (const platform of ['darwin', 'win32', 'linux']) {
      const accelerators = menuAccelerators(applicationMenuSpec(options(platform, true))).map((entry) => entry.accelerator.replace('CmdOrCtrl', platform === 'darwin' ? 'Cmd' : 'Ctrl'));
      expect(new Set(accelerators).size, platform).toBe(accelerators.length);
    }
  });

  it('lists recent projects as open-recent commands, or says there are none', () => {
    const spec = applicationMenuSpec(options('linux'));
    const submenu = find(spec, 'Open recent')!.submenu!;
    expect(submenu.map((item) => item.command)).toEqual([
      { command: 'open-recent-project', path: '/surveys/pond.whence' },
      { command: 'open-recent-project', path: '/surveys/hedge.whence' },
    ]);
    expect(submenu[0]!.label).toContain('Pond');
    const empty = find(applicationMenuSpec({ ...options('linux'), recentProjects: [] }), 'Open recent')!.submenu!;
    expect(empty).toEqual([{ label: 'No recent projects', enabled: false }]);
  });

  it('has the macOS application and Window menus only on macOS, and developer tools only when asked', () => {
    expect(applicationMenuSpec(options('darwin'))[0]).toMatchObject({ role: 'appMenu' });
    expect(applicationMenuSpec(options('darwin')).some((item) => item.role === 'windowMenu')).toBe(true);
    expect(applicationMenuSpec(options('linux')).some((item) => item.role === 'appMenu' || item.role === 'windowMenu')).toBe(false);
    const roles = (developerTools: boolean) => menuAccelerators(applicationMenuSpec(options('linux', developerTools))).map((entry) => entry.label);
    expect(roles(false)).not.toContain('toggleDevTools');
    expect(roles(true)).toContain('toggleDevTools');
  });
});

describe('toElectronTemplate()', () => {
  // Expected values: the behaviour this project specifies (labels, roles, shortcuts carried over); no outside reference.
  it('turns each command into a click that sends it, keeping labels, roles and shortcuts', () => {
    const sent: MenuCommand[] = [];
    const template = toElectronTemplate(applicationMenuSpec(options('linux')), (command) => sent.push(command));
    const file = template[0]!;
    const open = file.submenu!.find((item) => item.label === 'Open recording…')!;
    expect(open.accelerator).toBe('CmdOrCtrl+O');
    expect('command' in open).toBe(false);
    open.click!();
    file.submenu!.find((item) => item.label === 'Open recent')!.submenu![1]!.click!();
    expect(sent).toEqual([{ command: 'open-recording' }, { command: 'open-recent-project', path: '/surveys/hedge.whence' }]);
    expect(template[1]!.submenu!.find((item) => item.role === 'copy')!.click).toBeUndefined();
  });
});
