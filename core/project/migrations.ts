// Project schema versions and their step-by-step migrations: a file of version n passes through n -> n+1 -> ... -> current.
// Each step is a pure function on parsed JSON; a registry lists them and is checked to have no gap and no duplicate.
import { WhenceError } from '../errors';
import { WHENCE_VERSION } from '../version';

/** Parsed JSON object of a project file, before validation. */
export type ProjectData = Record<string, unknown>;

export interface ProjectMigration {
  /** The step turns a document of this version into one of fromVersion + 1. */
  fromVersion: number;
  /** One line saying what changed, for the upgrade notice. */
  summary: string;
  migrate(data: ProjectData): ProjectData;
}

export interface MigrationRegistry {
  /** The oldest version Whence ever wrote. */
  firstVersion: number;
  /** The version this Whence writes. */
  currentVersion: number;
  migrations: readonly ProjectMigration[];
}

export const CURRENT_PROJECT_SCHEMA_VERSION = 3;

/** The recording named on fixes of a version 2 file that named no recording. Size 0 matches no real recording. */
export const UNKNOWN_RECORDING_NAME = 'recording not named in the project';

/** Verdicts of fixes logged before verdicts existed: judged from their status alone (what version 1 kept). */
const VERDICT_FROM_V1_STATUS: Record<string, { grade: string; reason: string }> = {
  ok: { grade: 'doubtful', reason: 'Logged before verdicts: locate it again to judge it.' },
  ambiguous: { grade: 'doubtful', reason: 'Two spots fit equally: check the other one.' },
  'ill-conditioned': { grade: 'doubtful', reason: 'Poor geometry: long ellipse.' },
  insufficient: { grade: 'unusable', reason: 'Too few usable time differences to place it.' },
  'invalid-input': { grade: 'unusable', reason: 'The input has errors: see the warnings.' },
};

/** Add a step here with each new version (and a frozen fixture under test/fixtures/projects). */
export const PROJECT_MIGRATIONS: readonly ProjectMigration[] = [
  {
    fromVersion: 1,
    summary: 'each logged fix gets a verdict (firm, doubtful or unusable) with its main reason; fixes logged before are judged from their status alone, an ok fix as doubtful until it is located again',
    migrate: (data) => {
      const fixes = data.fixes;
      if (!Array.isArray(fixes)) return data;
      return {
        ...data,
        fixes: fixes.map((entry: unknown) => {
          if (typeof entry !== 'object' || entry === null || Array.isArray(entry)) return entry;
          const status = (entry as Record<string, unknown>).status;
          const verdict = typeof status === 'string' ? VERDICT_FROM_V1_STATUS[status] : undefined;
          return verdict === undefined ? entry : { ...entry, verdict: { ...verdict } };
        }),
      };
    },
  },
  {
    fromVersion: 2,
    summary: "each logged fix names its recording (the project's recording, by name and size) so fixes of different recordings are kept apart; quality figures are kept with fixes logged from now on",
    migrate: (data) => {
      const fixes = data.fixes;
      if (!Array.isArray(fixes)) return data;
      const reference = data.recording;
      let identity: Record<string, unknown> = { name: UNKNOWN_RECORDING_NAME, sizeBytes: 0 };
      if (typeof reference === 'object' && reference !== null && !Array.isArray(reference)) {
        const { name, sizeBytes } = reference as Record<string, unknown>;
        if (typeof name === 'string' && name !== '' && typeof sizeBytes === 'number') identity = { name, sizeBytes };
      }
      return {
        ...data,
        fixes: fixes.map((entry: unknown) => (typeof entry !== 'object' || entry === null || Array.isArray(entry) ? entry : { ...entry, recording: { ...identity } })),
      };
    },
  },
];

export const PROJECT_MIGRATION_REGISTRY: MigrationRegistry = Object.freeze({
  firstVersion: 1,
  currentVersion: CURRENT_PROJECT_SCHEMA_VERSION,
  migrations: PROJECT_MIGRATIONS,
});

export interface MigrationResult {
  data: ProjectData;
  /** The version the file was written with. */
  fromVersion: number;
  /** The summaries of the steps applied, oldest first (empty when the file was current). */
  steps: string[];
}

/** Throws WhenceError 'migration-registry-invalid' unless there is exactly one step from each version firstVersion..currentVersion-1. */
export function checkMigrationRegistry(registry: MigrationRegistry): void {
  const { firstVersion, currentVersion, migrations } = registry;
  if (!Number.isInteger(firstVersion) || !Number.isInteger(currentVersion) || firstVersion < 1 || currentVersion < firstVersion) {
    throw new WhenceError('migration-registry-invalid', `Project versions must be whole numbers with 1 <= first (${firstVersion}) <= current (${currentVersion}).`);
  }
  for (let version = firstVersion; version < currentVersion; version += 1) {
    const count = migrations.filter((step) => step.fromVersion === version).length;
    if (count !== 1) throw new WhenceError('migration-registry-invalid', `There must be exactly one project migration from version ${version}; there are ${count}.`);
  }
  const stray = migrations.find((step) => step.fromVersion < firstVersion || step.fromVersion >= currentVersion);
  if (stray !== undefined) throw new WhenceError('migration-registry-invalid', `A project migration starts at version ${stray.fromVersion}, outside ${firstVersion}..${currentVersion - 1}.`);
}

function describeValue(value: unknown): string {
  if (value === undefined) return 'missing';
  if (value === null) return 'null';
  return typeof value === 'string' ? `the text "${value.slice(0, 40)}"` : `${typeof value} ${String(value).slice(0, 40)}`;
}

/** The file's schemaVersion; refuses a missing or non-numeric one (project-invalid) and a newer one (project-too-new). */
export function readSchemaVersion(data: ProjectData, fileName: string, registry: MigrationRegistry = PROJECT_MIGRATION_REGISTRY): number {
  const version = data.schemaVersion;
  if (typeof version !== 'number' || !Number.isInteger(version)) {
    throw new WhenceError('project-invalid', `${fileName} is not a Whence project file: schemaVersion is ${describeValue(version)}, where a whole number is expected. Check that you chose a .whence project file; if it is one, it was damaged: open its backup (${fileName}.bak) if there is one.`);
  }
  if (version > registry.currentVersion) {
    const writtenBy = typeof data.writtenBy === 'string' ? ` by ${data.writtenBy.slice(0, 60)}` : '';
    throw new WhenceError('project-too-new', `${fileName} was saved${writtenBy} with project schema version ${version}, newer than this Whence (${WHENCE_VERSION}) can read (up to version ${registry.currentVersion}). Update Whence to open it; the file has not been changed.`);
  }
  if (version < registry.firstVersion) {
    throw new WhenceError('project-invalid', `${fileName} has schemaVersion ${version}, which no Whence ever wrote (the first is ${registry.firstVersion}). The file is damaged or is not a Whence project.`);
  }
  return version;
}

/** Brings parsed project data to the registry's current version, one step at a time. The input is not modified. */
export function migrateProjectData(data: ProjectData, fileName: string, registry: MigrationRegistry = PROJECT_MIGRATION_REGISTRY): MigrationResult {
  checkMigrationRegistry(registry);
  const fromVersion = readSchemaVersion(data, fileName, registry);
  let current: ProjectData = JSON.parse(JSON.stringify(data)) as ProjectData;
  const steps: string[] = [];
  for (let version = fromVersion; version < registry.currentVersion; version += 1) {
    const step = registry.migrations.find((candidate) => candidate.fromVersion === version)!;
    current = { ...step.migrate(current), schemaVersion: version + 1 };
    steps.push(step.summary);
  }
  return { data: current, fromVersion, steps };
}
