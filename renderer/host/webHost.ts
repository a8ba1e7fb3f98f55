// The host for a plain browser: file inputs to open, downloads to save and export, localStorage for the
// recovery copy, and the demo fetched from the web build's demo/ folder.
import { DEMO_FILE_NAMES, type ExportKind, type MenuCommand } from '../../core/contract';
import { parseProjectDocument, serializeProjectDocument, validateProjectDocument } from '../../core/project';
import type { Host, OpenedRecording, TextInput } from './host';

const RECOVERY_KEY = 'whence.recovery-copy';
const MIME: Record<ExportKind, string> = { csv: 'text/csv', json: 'application/json', geojson: 'application/geo+json' };

function pickFile(accept: string): Promise<File | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    input.dataset.testid = 'host-file-input';
    document.body.appendChild(input);
    const done = (file: File | null) => { input.remove(); resolve(file); };
    input.addEventListener('change', () => done(input.files?.[0] ?? null), { once: true });
    input.addEventListener('cancel', () => done(null), { once: true });
    input.click();
  });
}

function download(name: string, text: string, mime: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: `${mime};charset=utf-8` }));
  const anchor = document.createElement('a');
  anchor.href = url;
  anchor.download = name;
  anchor.style.display = 'none';
  document.body.appendChild(anchor);
  anchor.click();
  anchor.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

function blobRecording(blob: Blob, name: string): OpenedRecording {
  return { name, sizeBytes: blob.size, workerSource: { kind: 'blob', blob, name }, close: () => Promise.resolve() };
}

async function fetchOrExplain(url: string): Promise<Response> {
  let response: Response;
  try {
    response = await fetch(url);
  } catch {
    throw new Error(`The demo could not be loaded from ${url}. Run 'npm run demo' and serve the app again with 'npm run web'.`);
  }
  if (!response.ok) throw new Error(`The demo is not in this build (${url}: HTTP ${response.status}). Run 'npm run demo', then 'npm run web'.`);
  return response;
}

export function createWebHost(baseUrl = './'): Host {
  return {
    kind: 'web',
    description: 'web page',
    async openRecording() {
      const file = await pickFile('.wav,.rf64,.bw64,audio/wav,audio/x-wav');
      return file === null ? null : blobRecording(file, file.name);
    },
    openRecordingFile: (file) => Promise.resolve(blobRecording(file, file.name)),
    async openArrayFile() {
      const file = await pickFile('.csv,.txt,text/csv');
      return file === null ? null : { name: file.name, text: await file.text() };
    },
    readTextFile: async (file): Promise<TextInput> => ({ name: file.name, text: await file.text() }),
    async openProject() {
      const file = await pickFile('.whence,.json,application/json');
      if (file === null) return null;
      return { document: parseProjectDocument(await file.text(), file.name) };
    },
    saveProject(document, _path, _saveAs) {
      const checked = validateProjectDocument(document);
      const name = `${(checked.name || 'whence-project').replace(/[^\w.-]+/g, '-')}.whence`;
      download(name, serializeProjectDocument(checked), 'application/json');
      return Promise.resolve({ message: `Downloaded ${name}. Keep it with the recording; open it again with Open project.` });
    },
    exportText(suggestedName, text, kind) {
      download(suggestedName, text, MIME[kind]);
      return Promise.resolve(suggestedName);
    },
    async openDemo() {
      const { recording, array, project } = DEMO_FILE_NAMES;
      const [recordingResponse, arrayResponse, projectResponse] = await Promise.all([recording, array, project].map((name) => fetchOrExplain(`${baseUrl}demo/${name}`)));
      const blob = await recordingResponse!.blob();
      return {
        recording: blobRecording(blob, recording),
        array: { name: array, text: await arrayResponse!.text() },
        project: { name: project, text: await projectResponse!.text() },
      };
    },
    writeRecoveryCopy(document) {
      const savedAtIso = new Date().toISOString();
      try {
        localStorage.setItem(RECOVERY_KEY, JSON.stringify({ savedAtIso, text: serializeProjectDocument(document) }));
      } catch {
        // Storage full (a site picture of a few MB fills the browser's 5 MB): keep the rest of the work without the
        // picture; disabled storage: the recovery copy is a convenience, the saved file is the record.
        if (document.sitePicture === undefined) return Promise.resolve();
        const { sitePicture: _picture, ...rest } = document;
        try {
          localStorage.setItem(RECOVERY_KEY, JSON.stringify({ savedAtIso, text: serializeProjectDocument(rest) }));
        } catch {
          // Still too large or disabled.
        }
      }
      return Promise.resolve();
    },
    takeRecoveryCopy() {
      // Left in place until the user restores or discards it: a second crash before that offers it again.
      const stored = localStorage.getItem(RECOVERY_KEY);
      if (stored === null) return Promise.resolve(null);
      try {
        const { savedAtIso, text } = JSON.parse(stored) as { savedAtIso: string; text: string };
        return Promise.resolve({ document: parseProjectDocument(text, 'recovery copy'), savedAtIso });
      } catch {
        // A damaged copy is set aside (not deleted) so it is not offered on every start.
        localStorage.setItem(`${RECOVERY_KEY}.damaged`, stored);
        localStorage.removeItem(RECOVERY_KEY);
        return Promise.resolve(null);
      }
    },
    discardRecoveryCopy() {
      localStorage.removeItem(RECOVERY_KEY);
      return Promise.resolve();
    },
    onMenuCommand(_listener: (command: MenuCommand) => void) {
      return () => undefined;
    },
  };
}
