// Node side of project files: open, save with backup, the recovery copy of unsaved work, and the recent-projects list.
export { loadProjectFile, MAX_PROJECT_FILE_BYTES, projectBackupPath, saveProjectFile, withProjectExtension, type SavedProject } from './projectFiles';
export { createRecoveryStore, CORRUPT_RECOVERY_FILE_NAME, RECOVERY_FILE_NAME, type RecoveryStore } from './recoveryCopy';
export { createRecentProjectsStore, MAX_RECENT_PROJECTS, RECENT_PROJECTS_FILE_NAME, type RecentProjectsOptions, type RecentProjectsStore } from './recentProjects';
