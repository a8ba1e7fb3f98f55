// Recording check: open a WAV/RF64/BW64 file and see its format, length, start time and warnings (header only).
import { useState } from 'react';
import { readWavInfo, type WavInfo } from '../../core/audio';
import { blobByteSource } from '../io';

type State = { kind: 'empty' } | { kind: 'reading'; name: string } | { kind: 'read'; name: string; info: WavInfo } | { kind: 'failed'; name: string; message: string };

export function RecordingPanel() {
  const [state, setState] = useState<State>({ kind: 'empty' });

  async function open(file: File) {
    setState({ kind: 'reading', name: file.name });
    try {
      const info = await readWavInfo(blobByteSource(file, file.name));
      setState({ kind: 'read', name: file.name, info });
    } catch (error) {
      setState({ kind: 'failed', name: file.name, message: error instanceof Error ? error.message : String(error) });
    }
  }

  return (
    <section className="panel" aria-labelledby="recording-title">
      <h2 id="recording-title">Recording</h2>
      <label className="file-pick">
        Open a multichannel recording (WAV, RF64, BW64)
        <input type="file" accept=".wav,.rf64,.bw64,audio/wav" onChange={(event) => { const file = event.target.files?.[0]; if (file) void open(file); }} />
      </label>
      {state.kind === 'reading' && <p className="muted">Reading the header of {state.name}…</p>}
      {state.kind === 'failed' && <p className="error" role="alert">{state.name}: {state.message}</p>}
      {state.kind === 'read' && <RecordingFacts name={state.name} info={state.info} />}
    </section>
  );
}

function RecordingFacts({ name, info }: { name: string; info: WavInfo }) {
  const rows: Array<[string, string]> = [
    ['File', name],
    ['Format', `${info.formatDescription} (${info.container})`],
    ['Channels', String(info.channelCount)],
    ['Sample rate', `${info.sampleRateHz} Hz`],
    ['Frames', String(info.frameCount)],
    ['Duration', `${info.durationSeconds.toFixed(3)} s`],
    ['Start time', info.startTime?.isoLocal ?? 'not recorded in the file'],
  ];
  return (
    <>
      <table className="facts">
        <tbody>
          {rows.map(([key, value]) => (
            <tr key={key}><th scope="row">{key}</th><td>{value}</td></tr>
          ))}
        </tbody>
      </table>
      {info.warnings.length > 0 && (
        <ul className="warnings">
          {info.warnings.map((warning) => <li key={warning}>{warning}</li>)}
        </ul>
      )}
    </>
  );
}
