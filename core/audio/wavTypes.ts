// What readWavInfo() learns from a WAV/RF64/BW64 header: layout, sizes in bytes and frames, BWF start time, tags.
// Sizes in bytes, durations in seconds, rates in Hz; the start time is local wall-clock time as the recorder wrote it.

/** Start time of the first sample, from the Broadcast Wave `bext` chunk (EBU Tech 3285). */
export interface WavStartTime {
  /** Local time of the first sample, 'YYYY-MM-DDTHH:MM:SS.mmm' (rounded to the millisecond, no time zone). */
  isoLocal: string;
  /** OriginationDate as written in the file (trimmed). */
  originationDate: string;
  /** OriginationTime as written in the file (trimmed). */
  originationTime: string;
  /** TimeReference: samples since midnight of OriginationDate (0 when absent). */
  timeReferenceFrames: number;
  /** Which field gave the start: TimeReference (to the sample) or OriginationTime (to the second). */
  basis: 'time-reference' | 'origination-time';
  /** OriginationDate normalised to 'YYYY-MM-DD'. */
  dateIso: string;
  /** Frames from midnight of dateIso to the first sample (exact integer; may exceed one day). */
  framesSinceMidnight: number;
  sampleRateHz: number;
}

/** The sample layout the decoder needs; WavInfo satisfies it. */
export interface SampleLayout {
  sampleFormat: 'pcm-int' | 'ieee-float';
  channelCount: number;
  /** Container bits per sample: 8, 16, 24, 32 (int) or 32, 64 (float). */
  bitsPerSample: number;
  blockAlignBytes: number;
}

export interface WavInfo extends SampleLayout {
  container: 'RIFF' | 'RF64' | 'BW64';
  /** Format tag as written: 1 (PCM), 3 (IEEE float), 0xFFFE (WAVE_FORMAT_EXTENSIBLE). */
  formatTag: number;
  /** Human text, e.g. 'PCM 24-bit (WAVE_FORMAT_EXTENSIBLE)', 'IEEE float 32-bit', 'RF64 PCM 24-bit'. */
  formatDescription: string;
  sampleRateHz: number;
  validBitsPerSample: number;
  /** Speaker mask of WAVE_FORMAT_EXTENSIBLE (may be 0); undefined for plain formats. */
  channelMask: number | undefined;
  dataOffsetBytes: number;
  /** Usable bytes: whole frames, within the file. */
  dataLengthBytes: number;
  frameCount: number;
  durationSeconds: number;
  startTime: WavStartTime | undefined;
  /** LIST/INFO tags, e.g. { INAM: 'Dawn chorus' }. */
  infoTags: Record<string, string>;
  bextDescription: string | undefined;
  /** Sentences a user can act on (truncated file, unfinalised recording, ...). */
  warnings: string[];
}
