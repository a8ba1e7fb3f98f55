// The workspace shell: header, the recording check, the speed-of-sound calculator and the safety notes.
import { WHENCE_VERSION } from '../core/version';
import { detectHost } from './host';
import { RecordingPanel } from './panels/RecordingPanel';
import { SpeedPanel } from './panels/SpeedPanel';
import { CautionsPanel } from './panels/CautionsPanel';

export function App() {
  const host = detectHost();
  return (
    <div className="workspace">
      <header className="topbar">
        <h1>Whence</h1>
        <span className="subtitle">where a sound came from</span>
        <span className="host">{host ? `desktop ${host.appVersion}` : `web ${WHENCE_VERSION}`}</span>
      </header>
      <main className="panels">
        <RecordingPanel />
        <SpeedPanel />
        <CautionsPanel />
      </main>
    </div>
  );
}
