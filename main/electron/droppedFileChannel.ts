// The one message the preload sends main outside the host API: the path of a file the user dropped (droppedFileGrants.ts).
// Kept free of imports, as the sandboxed preload bundles it.
export const DROPPED_FILE_CHANNEL = 'whence:dropped-file';
