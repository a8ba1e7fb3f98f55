// Safety notes and a short account of Whence shown in the app: the same cautions as the README.
import { WHENCE_VERSION } from '../../core/version';

export function CautionsPanel() {
  return (
    <section className="panel cautions" aria-labelledby="cautions-title" data-testid="safety-panel">
      <p className="muted">Whence {WHENCE_VERSION} finds each sound in a synchronized multichannel recording, measures the time difference of arrival at every microphone pair by generalized cross-correlation (GCC-PHAT and its relatives), and fixes where it came from by least squares, with an uncertainty ellipse from the timing, the speed of sound and the survey of the microphones.</p>
      <h2 id="cautions-title">Before you act on a fix</h2>
      <ul>
        <li>A fix is an estimate with an uncertainty. Never send people towards a located source, or clear an area, on a fix alone; follow your site's procedures and local rules.</li>
        <li>Every fix carries a verdict: firm, doubtful or unusable. It judges whether the fix holds together, not whether it is true: a firm fix can still be wrong (a strong echo, a survey error). Check doubtful fixes first, and never act on an unusable one.</li>
        <li>Locating gunfire, blasts or other hazardous sources is for trained, authorised staff under local law and licensed practice. Whence is a survey aid, not a safety system.</li>
        <li>Calibration and test sounds can be loud enough to harm hearing and disturb wildlife: use hearing protection, keep to permitted levels and times, and warn people nearby.</li>
        <li>Work near water, roads, ranges or wildlife under the site's safety plan and any permits it requires.</li>
      </ul>
    </section>
  );
}
