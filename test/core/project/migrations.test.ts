import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import {
  checkMigrationRegistry,
  CURRENT_PROJECT_SCHEMA_VERSION,
  migrateProjectData,
  PROJECT_MIGRATION_REGISTRY,
  readSchemaVersion,
  type MigrationRegistry,
  type ProjectMigration,
} from '../../../core/project';

// A made-up history for the framework: v1 had `title`, v2 renamed it to `name`, v3 added `fixes`.
const renameTitle: ProjectMigration = {
  fromVersion: 1,
  summary: 'title renamed to name',
  migrate: ({ title, ...rest }) => ({ ...rest, name: title }),
};
const addFixes: ProjectMigration = {
  fromVersion: 2,
  summary: 'fix log added',
  migrate: (data) => ({ ...data, fixes: [] }),
};
const history: MigrationRegistry = { firstVersion: 1, currentVersion: 3, migrations: [addFixes, renameTitle] };

function codeOf(action: () => unknown): string {
  try {
    action();
  } catch (error) {
    expect(error).toBeInstanceOf(WhenceError);
    return (error as WhenceError).code;
  }
  return 'nothing thrown';
}

describe('PROJECT_MIGRATION_REGISTRY', () => {
  // Expected values: the behaviour this project specifies (schema versions, step order, error codes, messages); no outside reference.
  it('is complete for the current version (3: each logged fix names its recording)', () => {
    expect(CURRENT_PROJECT_SCHEMA_VERSION).toBe(3);
    expect(PROJECT_MIGRATION_REGISTRY.currentVersion).toBe(CURRENT_PROJECT_SCHEMA_VERSION);
    expect(() => checkMigrationRegistry(PROJECT_MIGRATION_REGISTRY)).not.toThrow();
  });
});

describe('migrateProjectData()', () => {
  it('applies every step in order from the file version to the current one', () => {
    const result = migrateProjectData({ schemaVersion: 1, title: 'Pond' }, 'old.whence', history);
    expect(result.data).toEqual({ schemaVersion: 3, name: 'Pond', fixes: [] });
    expect(result.fromVersion).toBe(1);
    expect(result.steps).toEqual(['title renamed to name', 'fix log added']);
  });

  it('starts at the file version (a version-2 file gets only the last step)', () => {
    const result = migrateProjectData({ schemaVersion: 2, name: 'Pond' }, 'v2.whence', history);
    expect(result.data).toEqual({ schemaVersion: 3, name: 'Pond', fixes: [] });
    expect(result.steps).toEqual(['fix log added']);
  });

  it('leaves a current file as it is and never modifies its input', () => {
    const input = { schemaVersion: 1, title: 'Pond', nested: { a: [1, 2] } };
    const copy = JSON.parse(JSON.stringify(input));
    migrateProjectData(input, 'old.whence', { ...history, migrations: [addFixes, { ...renameTitle, migrate: (data) => { (data.nested as { a: number[] }).a.push(3); return data; } }] });
    expect(input).toEqual(copy);
    expect(migrateProjectData({ schemaVersion: 3, name: 'x' }, 'new.whence', history)).toEqual({ data: { schemaVersion: 3, name: 'x' }, fromVersion: 3, steps: [] });
  });

  it('refuses a newer version (project-too-new) and an unknown older one (project-invalid)', () => {
    expect(codeOf(() => migrateProjectData({ schemaVersion: 4 }, 'f.whence', history))).toBe('project-too-new');
    expect(codeOf(() => migrateProjectData({ schemaVersion: 0 }, 'f.whence', history))).toBe('project-invalid');
  });

  it('refuses to run with a registry that has a gap, a duplicate or a stray step', () => {
    expect(codeOf(() => migrateProjectData({ schemaVersion: 1 }, 'f.whence', { ...history, migrations: [addFixes] }))).toBe('migration-registry-invalid');
    expect(codeOf(() => checkMigrationRegistry({ ...history, migrations: [renameTitle, renameTitle, addFixes] }))).toBe('migration-registry-invalid');
    expect(codeOf(() => checkMigrationRegistry({ ...history, migrations: [renameTitle, addFixes, { ...addFixes, fromVersion: 3 }] }))).toBe('migration-registry-invalid');
    expect(codeOf(() => checkMigrationRegistry({ firstVersion: 2, currentVersion: 1, migrations: [] }))).toBe('migration-registry-invalid');
  });
});

describe('readSchemaVersion()', () => {
  it('returns a supported version and explains a newer one with the writer and the advice to update', () => {
    expect(readSchemaVersion({ schemaVersion: 1 }, 'a.whence')).toBe(1);
    try {
      readSchemaVersion({ schemaVersion: 7, writtenBy: 'Whence 3.2.0' }, 'a.whence');
      throw new Error('not refused');
    } catch (error) {
      expect(error).toMatchObject({ code: 'project-too-new' });
      expect((error as Error).message).toMatch(/a\.whence was saved by Whence 3\.2\.0 with project schema version 7.*Update Whence/);
    }
  });

  it('refuses a missing, textual or fractional version', () => {
    for (const schemaVersion of [undefined, '1', 1.5, null, {}]) {
      expect(codeOf(() => readSchemaVersion({ schemaVersion }, 'a.whence'))).toBe('project-invalid');
    }
  });
});
