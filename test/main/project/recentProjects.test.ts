import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createRecentProjectsStore, MAX_RECENT_PROJECTS, RECENT_PROJECTS_FILE_NAME } from '../../../main/project';

function setUp(existing: (path: string) => boolean = () => true) {
  const folder = mkdtempSync(join(tmpdir(), 'whence-recent-'));
  const file = join(folder, RECENT_PROJECTS_FILE_NAME);
  let seconds = 0;
  const store = createRecentProjectsStore(file, {
    clock: () => new Date(Date.UTC(2024, 4, 14, 22, 0, seconds++)),
    fileExists: async (path) => existing(path),
  });
  return { folder, file, store };
}

describe('createRecentProjectsStore()', () => {
  // Expected values: the behaviour this project specifies (order, limit, pruning); no outside reference.
  it('puts the newest first, once, named after the file', async () => {
    const { store } = setUp();
    await store.add('/s/pond.whence');
    await store.add('/s/hedge.whence', 'Hedgerow');
    const list = await store.add('/s/pond.whence');
    expect(list.map((project) => [project.path, project.name])).toEqual([['/s/pond.whence', 'pond'], ['/s/hedge.whence', 'Hedgerow']]);
    expect(list[0]!.openedAtIso).toBe('2024-05-14T22:00:02.000Z');
    expect(await store.list()).toEqual(list);
  });

  it(`keeps at most ${MAX_RECENT_PROJECTS}`, async () => {
    const { store } = setUp();
    for (let index = 0; index < 14; index += 1) await store.add(`/s/p${index}.whence`);
    const list = await store.list();
    expect(list).toHaveLength(MAX_RECENT_PROJECTS);
    expect(list[0]!.path).toBe('/s/p13.whence');
    expect(list.at(-1)!.path).toBe('/s/p4.whence');
  });

  it('drops projects whose file is gone and writes the pruned list back', async () => {
    const gone = new Set<string>();
    const { store, file } = setUp((path) => !gone.has(path));
    await store.add('/s/a.whence');
    await store.add('/s/b.whence');
    await store.add('/s/c.whence');
    gone.add('/s/b.whence');
    expect((await store.list()).map((project) => project.path)).toEqual(['/s/c.whence', '/s/a.whence']);
    expect(JSON.parse(readFileSync(file, 'utf8')).projects).toHaveLength(2);
  });

  it('checks the disk by default: a project file that does not exist is pruned', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-recent-'));
    const real = join(folder, 'real.whence');
    writeFileSync(real, '{}');
    const store = createRecentProjectsStore(join(folder, RECENT_PROJECTS_FILE_NAME));
    await store.add(join(folder, 'never-saved.whence'));
    await store.add(real);
    expect((await store.list()).map((project) => project.path)).toEqual([real]);
  });

  it('treats a damaged list as empty, and replaces it on the next add, atomically', async () => {
    const { store, file, folder } = setUp();
    writeFileSync(file, '{"recentVersion":1,"projects":[{"path":');
    expect(await store.list()).toEqual([]);
    await store.add('/s/a.whence');
    expect(JSON.parse(readFileSync(file, 'utf8')).projects[0].path).toBe('/s/a.whence');
    expect(readdirSync(folder)).toEqual([RECENT_PROJECTS_FILE_NAME]);
  });

  it('clear() empties the list', async () => {
    const { store } = setUp();
    await store.add('/s/a.whence');
    await store.clear();
    expect(await store.list()).toEqual([]);
  });
});
