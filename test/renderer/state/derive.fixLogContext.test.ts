import { describe, expect, it } from 'vitest';
import type { WavInfo } from '../../../core/audio';
import { locatedVerdict } from '../../../core/pipeline';
import { emptyProjectDocument, type ProjectDocument } from '../../../core/project';
import { fixLogEntryFromLocated } from '../../../renderer/fixlog';
import { fixLogContextOf } from '../../../renderer/state/derive';
import { locatedEvent, squareArray } from '../fixlog/locatedFixtures';

// Expected values: this project's rules for the fix log's export context; no outside reference.
const event = locatedEvent(squareArray, [20, 35, 1.5], 0, 2, 4);
const entry = fixLogEntryFromLocated(event, { id: 'a', recording: { name: 'night4.wav', sizeBytes: 100, contentHash: '00000000000000aa' }, verdict: locatedVerdict(event, { microphones: squareArray }) });
const document: ProjectDocument = { ...emptyProjectDocument('p'), array: { microphones: squareArray }, recording: { name: 'night4.wav', sizeBytes: 100, contentHash: '00000000000000aa', channelCount: 4, sampleRateHz: 48_000, frameCount: 10 }, fixes: [entry] };
const info = { channelCount: 4, sampleRateHz: 44_100, frameCount: 10, durationSeconds: 1, warnings: [] } as unknown as WavInfo;

describe('fixLogContextOf()', () => {
  it('exports a reopened project\'s log without its recording open, naming the project\'s recording', () => {
    const context = fixLogContextOf({ document, recording: undefined, events: [] });
    expect(context?.recordingName).toBe('night4.wav');
    expect(context?.sampleRateHz).toBe(48_000);
    expect(context?.located?.size).toBe(0);
    expect(fixLogContextOf({ document: { ...document, recording: undefined }, recording: undefined, events: [] })).toBeUndefined();
  });

  it('pairs an entry with a located event of the open recording only when it is the same recording', () => {
    expect(fixLogContextOf({ document, recording: { name: 'night4.wav', sizeBytes: 100, info, contentHash: '00000000000000aa' }, events: [event] })?.located?.get('a')).toBe(event);
    expect(fixLogContextOf({ document, recording: { name: 'night5.wav', sizeBytes: 100, info, contentHash: '00000000000000bb' }, events: [event] })?.located?.size).toBe(0);
  });
});
