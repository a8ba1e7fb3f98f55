// Picks files with a file input, in both hosts (Electron's renderer supports them): several files, or a whole folder
// (webkitdirectory). Resolves to the files, or null when the user cancelled. Call it from a click, before any await.
export interface PickOptions {
  /** Input accept list (ignored for folders). */
  accept?: string;
  multiple?: boolean;
  /** A folder and everything under it (each File's webkitRelativePath starts with the folder's name). */
  directory?: boolean;
  /** data-testid of the input, for the browser tests. */
  testId: string;
}

export function pickFiles(options: PickOptions): Promise<File[] | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    if (options.accept !== undefined && options.directory !== true) input.accept = options.accept;
    input.multiple = options.multiple === true || options.directory === true;
    if (options.directory === true) input.webkitdirectory = true;
    input.style.display = 'none';
    input.dataset.testid = options.testId;
    document.body.appendChild(input);
    const done = (files: File[] | null) => { input.remove(); resolve(files); };
    input.addEventListener('change', () => done(input.files === null || input.files.length === 0 ? null : Array.from(input.files)), { once: true });
    input.addEventListener('cancel', () => done(null), { once: true });
    input.click();
  });
}
