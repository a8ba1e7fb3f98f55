// What the workspace does for each command of the application menu (core/contract MENU_COMMANDS): the same calls as the
// toolbar's buttons. Pure dispatch over the controller's methods; commands the page does not act on are ignored.
import type { MenuCommand } from '../../core/contract';
import type { WorkspaceController } from './useWorkspace';

export type MenuTarget = Pick<WorkspaceController, 'openRecording' | 'showDeploymentDialog' | 'openArray' | 'openProject' | 'saveProject' | 'exportLog' | 'openDemo' | 'newProject'>;

/** Acts on one menu command; true when the workspace acted on it. */
export function runMenuCommand(command: MenuCommand, target: MenuTarget): boolean {
  switch (command.command) {
    case 'open-recording': void target.openRecording(); return true;
    case 'open-deployment': target.showDeploymentDialog(true); return true;
    case 'open-array': void target.openArray(); return true;
    case 'open-project': void target.openProject(); return true;
    case 'save-project': void target.saveProject(false); return true;
    case 'save-project-as': void target.saveProject(true); return true;
    case 'export-log': void target.exportLog('csv'); return true;
    case 'open-demo': void target.openDemo(); return true;
    case 'new-project': void target.newProject(); return true;
    default: return false;
  }
}
