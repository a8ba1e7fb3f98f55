import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { MAX_RECORDING_READ_BYTES } from '../../../core/contract';
import { memoryByteSource } from '../../../core/audio';
import { createRecordingHandles } from '../../../main/electron/recordingHandles';
import type { FileByteSource } from '../../../main/io';

const wavPath = join(__dirname, '../../fixtures/audio/sox-2ch-16bit-plain.wav');

function fakeOpener() {
  const closed: string[] = [];
  const open = async (path: string): Promise<FileByteSource> => {
    const bytes = new Uint8Array(100).map((_, index) => index);
    return { ...memoryByteSource(bytes, path), close: async () => { closed.push(path); } };
  };
  return { open, closed };
}

describe('createRecordingHandles()', () => {
  // Expected values: the bytes of the sox-made fixture read directly from disk; a WAV file starts with 'RIFF' (Microsoft RIFF/WAVE, common practice); limits and codes are this project's.
  it('opens a recording on disk and reads any window of it', async () => {
    const handles = createRecordingHandles({ newHandleId: () => 'recording-a' });
    const handle = await handles.open(wavPath);
    const bytes = readFileSync(wavPath);
    expect(handle).toEqual({ handleId: 'recording-a', name: 'sox-2ch-16bit-plain.wav', path: wavPath, sizeBytes: bytes.length });
    expect(Buffer.from(await handles.read('recording-a', 0, 4)).toString('latin1')).toBe('RIFF');
    expect(await handles.read('recording-a', 40, 24)).toEqual(new Uint8Array(bytes.subarray(40, 64)));
    await handles.close('recording-a');
    expect(handles.openCount()).toBe(0);
  });

  it('says a recording is no longer open after it was closed, or for an unknown handle', async () => {
    const { open } = fakeOpener();
    const handles = createRecordingHandles({ openSource: open, newHandleId: () => 'h1' });
    await handles.open('/a.wav');
    await handles.close('h1');
    await expect(handles.read('h1', 0, 1)).rejects.toMatchObject({ code: 'recording-not-open' });
    await expect(handles.read('never', 0, 1)).rejects.toThrow(/no longer open.*Open it again/);
    await expect(handles.close('never')).resolves.toBeUndefined();
  });

  it('refuses reads that are negative, fractional or longer than 256 MiB', async () => {
    const { open } = fakeOpener();
    const handles = createRecordingHandles({ openSource: open, newHandleId: () => 'h1' });
    await handles.open('/a.wav');
    for (const [offset, length] of [[-1, 1], [0.5, 1], [0, -1], [0, MAX_RECORDING_READ_BYTES + 1]] as const) {
      await expect(handles.read('h1', offset, length)).rejects.toMatchObject({ code: 'read-out-of-range' });
    }
    expect(await handles.read('h1', 98, 10)).toEqual(new Uint8Array([98, 99]));
  });

  it('keeps at most the given number open, and closeAll() closes every one', async () => {
    const { open, closed } = fakeOpener();
    let next = 0;
    const handles = createRecordingHandles({ openSource: open, newHandleId: () => `h${next++}`, maxOpen: 3 });
    for (const name of ['a', 'b', 'c']) await handles.open(`/${name}.wav`);
    await expect(handles.open('/d.wav')).rejects.toMatchObject({ code: 'too-many-recordings' });
    await handles.closeAll();
    expect(closed.sort()).toEqual(['/a.wav', '/b.wav', '/c.wav']);
    expect(handles.openCount()).toBe(0);
    await expect(handles.open('/d.wav')).resolves.toMatchObject({ name: 'd.wav' });
  });

  it('passes on the reason a file could not be opened', async () => {
    await expect(createRecordingHandles().open('/no/such/folder/x.wav')).rejects.toMatchObject({ code: 'file-open-failed' });
  });
});
