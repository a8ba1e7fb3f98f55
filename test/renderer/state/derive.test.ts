import { describe, expect, it } from 'vitest';
import { emptyProjectDocument, type ArrayMicrophone, type ProjectDocument } from '../../../core/project';
import { locateReadiness } from '../../../renderer/state/derive';

function documentWith(channels: number[]): ProjectDocument {
  const microphones: ArrayMicrophone[] = channels.map((channel, i) => ({ label: `M${i + 1}`, channel, eastMeters: 10 * i, northMeters: 5 * (i % 2), upMeters: 1, surveySigmaMeters: 0.05 }));
  return { ...emptyProjectDocument('test'), array: { microphones } };
}

describe('locateReadiness()', () => {
  it('gives the locate context with each microphone\'s 0-based channel when the array fits the recording', () => {
    const ready = locateReadiness(documentWith([2, 1, 4]), { name: 'site.wav', info: { channelCount: 4 } });
    expect('context' in ready && ready.context.channelIndexOfMicrophone).toEqual([1, 0, 3]);
  });

  it('names the microphones beyond the recording\'s channels, as the command line does', () => {
    const ready = locateReadiness(documentWith([1, 2, 5]), { name: 'site.wav', info: { channelCount: 4 } });
    expect('problems' in ready && ready.problems.join(' ')).toMatch(/^The array uses 3 microphones up to channel 5, but site\.wav has 4 channels: M3 \(channel 5\)/);
  });

  it('asks for a recording, and for a third microphone once one is open', () => {
    expect(locateReadiness(documentWith([1, 2, 3]), undefined)).toEqual({ problems: ['Open a recording first.'] });
    const ready = locateReadiness(documentWith([1, 2]), { name: 'site.wav', info: { channelCount: 2 } });
    expect('problems' in ready && ready.problems.join(' ')).toMatch(/at least 3/);
  });
});
