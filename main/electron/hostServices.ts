// What each host request does on the Node side: dialogs, open recordings, array tables, projects (open, save with
// backup, recent list), exports, the recovery copy and the demo. Arguments arrive already validated (ipcHandlers.ts).
import { stat } from 'node:fs/promises';
import { basename, extname, join, resolve } from 'node:path';
import { DEMO_FILE_NAMES, type HostApi, type HostRequestMethod, type OpenedProject, type RecentProject, type SaveResult, type TextFile } from '../../core/contract';
import { isWhenceError, WhenceError } from '../../core/errors';
import { describeFileProblem, readSmallTextFile, writeFileAtomic } from '../files';
import { loadProjectFile, saveProjectFile, withProjectExtension, type RecentProjectsStore, type RecoveryStore } from '../project';
import { ARRAY_FILTERS, EXPORT_FILTERS, PROJECT_FILTERS, RECORDING_FILTERS, safeFileName, type DialogAdapter } from './dialogs';
import { checkUserPath } from './pathPolicy';
import type { RecordingHandles } from './recordingHandles';
import { createUserFileGrants, type UserFileGrants } from './userFileGrants';

export type HostServices = { [K in HostRequestMethod]: (...args: Parameters<HostApi[K]>) => ReturnType<HostApi[K]> };

/** An array table larger than this is refused (a recording chosen by mistake, most likely). */
export const MAX_ARRAY_FILE_BYTES = 16 * 1024 * 1024;
export const DEMO_RECORDING_FILE_NAME = DEMO_FILE_NAMES.recording;
export const DEMO_ARRAY_FILE_NAME = DEMO_FILE_NAMES.array;
export const DEMO_PROJECT_FILE_NAME = DEMO_FILE_NAMES.project;

export interface HostServiceDeps {
  dialogs: DialogAdapter;
  recordings: RecordingHandles;
  recovery: RecoveryStore;
  recent: RecentProjectsStore;
  /** Files the user chose; the page's open-by-path requests are limited to them (a fresh, empty set when not given). */
  grants?: UserFileGrants;
  /** The folder holding the demo recording and array (assets/demo/out, or the packaged app's resources). */
  demoFolder: string;
  /** Told after the recent list changed (to rebuild the menu). */
  onRecentProjectsChanged?: (projects: RecentProject[]) => void;
  /** Problems that do not stop the request (the recent list could not be written, ...). */
  log?: (message: string) => void;
}

async function readTextFile(path: string, what: string): Promise<TextFile> {
  try {
    const tooLarge = (sizeBytes: number) => new WhenceError('array-open-failed', `${path} is ${(sizeBytes / 2 ** 20).toFixed(0)} MiB, far larger than ${what}; check that you chose the right file.`);
    return { name: basename(path), path, text: await readSmallTextFile(path, MAX_ARRAY_FILE_BYTES, tooLarge) };
  } catch (error) {
    if (isWhenceError(error)) throw error;
    throw new WhenceError('array-open-failed', `Could not open ${what} ${path}: ${describeFileProblem(error)}.`);
  }
}

function withExtension(path: string, extension: string): string {
  return extname(path).toLowerCase() === extension ? path : `${path}${extension}`;
}

export function createHostServices(deps: HostServiceDeps): HostServices {
  const { dialogs, recordings, recovery, recent } = deps;
  const log = deps.log ?? (() => undefined);
  const grants = deps.grants ?? createUserFileGrants();
  /** Paths the user chose or opened this session: only these are saved to without asking. */
  const writablePaths = new Set<string>();

  async function remember(path: string, name: string): Promise<void> {
    try {
      const projects = await recent.add(path, name || undefined);
      deps.onRecentProjectsChanged?.(projects);
    } catch (error) {
      log(`The recent-projects list could not be updated: ${error instanceof Error ? error.message : String(error)}`);
    }
  }

  /** A project may be opened by path when the user chose it or it is on the recent list (both made by the user). */
  async function requireProjectPath(path: string): Promise<string> {
    const checked = checkUserPath(path, 'project');
    if (await grants.isGranted(checked)) return checked;
    const recentProjects = await recent.list().catch(() => []);
    if (recentProjects.some((project) => resolve(project.path) === resolve(checked))) return checked;
    return grants.require(checked);
  }

  async function openProject(path: string): Promise<OpenedProject> {
    const opened = await loadProjectFile(checkUserPath(path, 'project'));
    // The user chose this project, and with it the recording it names.
    await grants.grant(opened.path);
    if (opened.document.recording?.path !== undefined) await grants.grant(opened.document.recording.path);
    if (opened.path.toLowerCase().endsWith('.whence')) writablePaths.add(resolve(opened.path));
    await remember(opened.path, opened.document.name);
    return opened;
  }

  return {
    async openRecordingDialog() {
      const path = await dialogs.chooseFileToOpen({ title: 'Open recording', filters: RECORDING_FILTERS });
      if (path === null) return null;
      await grants.grant(path);
      return recordings.open(path);
    },
    openRecordingPath: async (path) => recordings.open(await grants.require(checkUserPath(path, 'recording'))),
    readRecordingBytes: (handleId, offsetBytes, lengthBytes) => recordings.read(handleId, offsetBytes, lengthBytes),
    closeRecording: (handleId) => recordings.close(handleId),

    async openArrayDialog() {
      const path = await dialogs.chooseFileToOpen({ title: 'Open array table', filters: ARRAY_FILTERS });
      if (path === null) return null;
      await grants.grant(path);
      return readTextFile(path, 'the array table');
    },
    openArrayPath: async (path) => readTextFile(await grants.require(checkUserPath(path, 'array')), 'the array table'),

    async openProjectDialog() {
      const path = await dialogs.chooseFileToOpen({ title: 'Open project', filters: PROJECT_FILTERS });
      return path === null ? null : openProject(path);
    },
    openProjectPath: async (path) => openProject(await requireProjectPath(path)),

    async saveProject({ document, path, saveAs }) {
      const known = path !== undefined && !saveAs && writablePaths.has(resolve(path));
      const chosen = known
        ? path
        : await dialogs.chooseFileToSave({ title: 'Save project', defaultPath: path ?? `${safeFileName(document.name, 'Untitled')}.whence`, filters: PROJECT_FILTERS });
      if (chosen === null) return null;
      const target = withProjectExtension(chosen);
      let result: SaveResult;
      try {
        result = await saveProjectFile(target, document);
      } catch (error) {
        if (isWhenceError(error)) return { error: error.message };
        throw error;
      }
      writablePaths.add(resolve(target));
      await grants.grant(target);
      await remember(target, document.name);
      await recovery.discardIfSaved(document).catch((error: unknown) => log(`The recovery copy could not be cleared: ${String(error)}`));
      return result;
    },

    async exportText({ suggestedName, text, kind }) {
      const extension = `.${kind}`;
      const defaultName = withExtension(safeFileName(basename(suggestedName), `whence-export${extension}`), extension);
      const chosen = await dialogs.chooseFileToSave({ title: 'Export', defaultPath: defaultName, filters: EXPORT_FILTERS[kind] });
      if (chosen === null) return null;
      const target = withExtension(chosen, extension);
      try {
        await writeFileAtomic(target, text);
      } catch (error) {
        if (isWhenceError(error)) return { error: error.message };
        throw error;
      }
      return { path: target };
    },

    async listRecentProjects() {
      const projects = await recent.list();
      deps.onRecentProjectsChanged?.(projects);
      return projects;
    },

    writeRecoveryCopy: (document, projectPath) => recovery.write(document, projectPath),
    takeRecoveryCopy: () => recovery.take(),
    discardRecoveryCopy: () => recovery.discard(),

    async openDemo() {
      const recordingPath = join(deps.demoFolder, DEMO_RECORDING_FILE_NAME);
      const arrayPath = join(deps.demoFolder, DEMO_ARRAY_FILE_NAME);
      const projectPath = join(deps.demoFolder, DEMO_PROJECT_FILE_NAME);
      const present = await Promise.all([recordingPath, arrayPath, projectPath].map((path) => stat(path).then((stats) => stats.isFile(), () => false)));
      if (!present.every(Boolean)) {
        throw new WhenceError('demo-missing', `The demo files are missing: Whence looked for ${DEMO_RECORDING_FILE_NAME}, ${DEMO_ARRAY_FILE_NAME} and ${DEMO_PROJECT_FILE_NAME} in ${deps.demoFolder}. Run \`npm run demo\` to make them, then open the demo again.`);
      }
      const array = await readTextFile(arrayPath, 'the demo array table');
      const project = await readTextFile(projectPath, 'the demo project');
      const recording = await recordings.open(recordingPath);
      return { recording, array, project };
    },
  };
}
