// The recent-projects list, a small JSON file in the app's data folder: newest first, at most ten, written atomically;
// projects whose file is gone are dropped when the list is read.
import { mkdir, readFile, stat } from 'node:fs/promises';
import { basename, dirname } from 'node:path';
import { z } from 'zod';
import type { RecentProject } from '../../core/contract';
import { writeFileAtomic } from '../files';

export const MAX_RECENT_PROJECTS = 10;
export const RECENT_PROJECTS_FILE_NAME = 'recent-projects.json';

const recentFileSchema = z.object({
  recentVersion: z.literal(1),
  projects: z.array(z.object({ path: z.string().min(1), name: z.string(), openedAtIso: z.string() })),
});

export interface RecentProjectsStore {
  /** The list with missing files pruned (and the pruned list written back). */
  list(): Promise<RecentProject[]>;
  /** Puts a project first (once), keeps at most MAX_RECENT_PROJECTS, and returns the new list. */
  add(path: string, name?: string): Promise<RecentProject[]>;
  clear(): Promise<void>;
}

export interface RecentProjectsOptions {
  clock?: () => Date;
  /** Whether a project file is still there; default: it is a file on disk. */
  fileExists?: (path: string) => Promise<boolean>;
}

async function isFile(path: string): Promise<boolean> {
  try {
    return (await stat(path)).isFile();
  } catch {
    return false;
  }
}

/** A list kept in `filePath`. An unreadable or damaged file counts as an empty list (it is only a convenience). */
export function createRecentProjectsStore(filePath: string, options: RecentProjectsOptions = {}): RecentProjectsStore {
  const clock = options.clock ?? (() => new Date());
  const fileExists = options.fileExists ?? isFile;
  let queue: Promise<unknown> = Promise.resolve();
  const serial = <T>(operation: () => Promise<T>): Promise<T> => {
    const next = queue.then(operation, operation);
    queue = next.catch(() => undefined);
    return next;
  };

  async function read(): Promise<RecentProject[]> {
    try {
      return recentFileSchema.parse(JSON.parse(await readFile(filePath, 'utf8'))).projects;
    } catch {
      return [];
    }
  }

  async function write(projects: RecentProject[]): Promise<void> {
    await mkdir(dirname(filePath), { recursive: true });
    await writeFileAtomic(filePath, `${JSON.stringify({ recentVersion: 1, projects }, null, 2)}\n`);
  }

  return {
    list: () => serial(async () => {
      const stored = await read();
      const present: RecentProject[] = [];
      for (const project of stored.slice(0, MAX_RECENT_PROJECTS)) if (await fileExists(project.path)) present.push(project);
      if (present.length !== stored.length) await write(present);
      return present;
    }),
    add: (path, name) => serial(async () => {
      const entry: RecentProject = { path, name: name ?? basename(path).replace(/\.whence$/i, ''), openedAtIso: clock().toISOString() };
      const projects = [entry, ...(await read()).filter((project) => project.path !== path)].slice(0, MAX_RECENT_PROJECTS);
      await write(projects);
      return projects;
    }),
    clear: () => serial(() => write([])),
  };
}
