// The zod schema of the project document, schema version 3: array, medium, settings, recording reference, fix log, map view.
// Positions in local east/north/up metres, times in seconds (from the start of the recording), frequencies in Hz.
import { z } from 'zod';
import { gccWeightings, type GccWeighting } from '../dsp';
import { VERDICT_GRADES, type FixStatus, type VerdictGrade } from '../locate';
import { MAX_MICROPHONES } from './arrayGeometry';
import { sitePictureSchema } from './sitePicture';

const MAX_LABEL_CHARS = 200;
const MAX_PATH_CHARS = 4096;
const MAX_NOTE_CHARS = 10_000;
/** Bounds that keep a document (and an IPC message carrying one) a sensible size. */
export const PROJECT_LIMITS = Object.freeze({ microphones: MAX_MICROPHONES, fixes: 100_000, warningsPerFix: 100 });

export const FIX_STATUSES = ['ok', 'ambiguous', 'ill-conditioned', 'inconsistent', 'insufficient', 'invalid-input'] as const satisfies readonly FixStatus[];

const label = z.string().max(MAX_LABEL_CHARS);
const filePath = z.string().min(1).max(MAX_PATH_CHARS);

export const frequencyBandSchema = z
  .object({ lowHz: z.number().nonnegative(), highHz: z.number().positive() })
  .refine((band) => band.highHz > band.lowHz, { message: 'highHz must be above lowHz', path: ['highHz'] });

export const microphoneSchema = z.object({
  channel: z.number().int().min(1, 'a channel is a whole number from 1 (the first channel of the recording)'),
  label,
  eastMeters: z.number(),
  northMeters: z.number(),
  upMeters: z.number(),
  surveySigmaMeters: z.number().nonnegative(),
});

export const geodeticOriginSchema = z.object({
  latitudeDegrees: z.number().min(-90).max(90),
  longitudeDegrees: z.number().min(-180).max(180),
  heightMeters: z.number(),
});

export const arraySchema = z
  .object({
    microphones: z.array(microphoneSchema).max(PROJECT_LIMITS.microphones),
    origin: geodeticOriginSchema.optional(),
    /** Name of the array table it was read from, when known. */
    sourceName: z.string().max(MAX_PATH_CHARS).optional(),
  })
  .superRefine((array, context) => {
    const seen = new Map<number, number>();
    array.microphones.forEach((microphone, index) => {
      const previous = seen.get(microphone.channel);
      if (previous !== undefined) {
        context.addIssue({ code: 'custom', path: ['microphones', index, 'channel'], message: `channel ${microphone.channel} is already used by microphone ${previous + 1}; each microphone needs its own channel` });
      }
      seen.set(microphone.channel, index);
    });
  });

const temperatureSigmaKelvin = z.number().nonnegative();

export const mediumSchema = z.discriminatedUnion('medium', [
  z.object({
    medium: z.literal('air'),
    temperatureCelsius: z.number(),
    relativeHumidityPercent: z.number().min(0).max(100).optional(),
    pressureKilopascals: z.number().positive().optional(),
    co2PartsPerMillion: z.number().nonnegative().optional(),
    model: z.enum(['cramer', 'ideal-gas']).optional(),
    temperatureSigmaKelvin,
  }),
  z.object({
    medium: z.literal('seawater'),
    temperatureCelsius: z.number(),
    salinityPartsPerThousand: z.number().nonnegative().optional(),
    depthMeters: z.number().nonnegative().optional(),
    temperatureSigmaKelvin,
  }),
  z.object({ medium: z.literal('freshwater'), temperatureCelsius: z.number(), temperatureSigmaKelvin }),
  z.object({
    medium: z.literal('fixed-speed'),
    speedMetersPerSecond: z.number().positive(),
    speedSigmaMetersPerSecond: z.number().nonnegative(),
  }),
]);

export const settingsSchema = z.object({
  dimensions: z.union([z.literal(2), z.literal(3)]),
  /** 2-D: the source height; absent means the microphones' mean height. */
  sourceUpMeters: z.number().optional(),
  /** 2-D: one-sigma uncertainty of that height, metres (a range LOW..HIGH: (HIGH - LOW) / sqrt(12)); absent means 0. */
  sourceUpSigmaMeters: z.number().nonnegative().optional(),
  confidence: z.number().gt(0).lt(1),
  weighting: z.enum(gccWeightings as readonly GccWeighting[] as [GccWeighting, ...GccWeighting[]]),
  /** Correlation band, or 'automatic' to choose it per event from its spectrum. */
  bandHz: z.union([z.literal('automatic'), frequencyBandSchema]),
  /** Energy above the noise floor that starts an event, dB; absent means the detector's default. */
  detectionThresholdDb: z.number().positive().optional(),
  /** Channels that must agree for an event; absent means the detector's default. */
  minChannels: z.number().int().min(2).optional(),
  /** Band the detector listens in; absent means the detector's default. */
  detectionBandHz: frequencyBandSchema.optional(),
});

/**
 * A recording's identity (version 3 on): name and size, the BWF start time when the file has one, and the content hash of
 * its first and last bytes (core/audio recordingFingerprint), which still recognises the file after it was renamed.
 */
export const recordingIdentitySchema = z.object({
  name: z.string().min(1).max(MAX_PATH_CHARS),
  sizeBytes: z.number().int().nonnegative(),
  /** Local time of the first sample, 'YYYY-MM-DDTHH:MM:SS.mmm', when the file carries one. */
  startTimeIso: z.string().max(MAX_LABEL_CHARS).optional(),
  /** 16 hex digits: FNV-1a 64 of the size and the first and last 64 KiB (core/audio recordingFingerprint). */
  contentHash: z.string().regex(/^[0-9a-f]{16}$/, 'a content hash is 16 lower-case hex digits').optional(),
});

/** Enough about the recording to find it again and to recognise it after it was moved or renamed. */
export const recordingReferenceSchema = recordingIdentitySchema.extend({
  path: filePath.optional(),
  channelCount: z.number().int().min(1),
  sampleRateHz: z.number().positive(),
  frameCount: z.number().int().nonnegative(),
});

const squareCovariance = z
  .array(z.array(z.number()))
  .refine((rows) => (rows.length === 2 || rows.length === 3) && rows.every((row) => row.length === rows.length), {
    message: 'a covariance is a 2x2 (east, north) or 3x3 (east, north, up) matrix in square metres',
  });

const fixLogEntryFieldsV2 = z
  .object({
    id: z.string().min(1).max(MAX_LABEL_CHARS),
    eventIndex: z.number().int().nonnegative(),
    emissionTimeSeconds: z.number().optional(),
    firstArrivalSeconds: z.number(),
    /** Wall-clock time of the first arrival when the recording carries a start time (ISO 8601 text). */
    localTime: z.string().max(MAX_LABEL_CHARS).optional(),
    status: z.enum(FIX_STATUSES),
    /** The plain-words verdict (core/locate fixVerdict): grade and main reason (version 2 on). */
    verdict: z.object({ grade: z.enum(VERDICT_GRADES as readonly VerdictGrade[] as [VerdictGrade, ...VerdictGrade[]]), reason: z.string().max(MAX_LABEL_CHARS) }),
    eastMeters: z.number().optional(),
    northMeters: z.number().optional(),
    upMeters: z.number().optional(),
    covarianceMeters2: squareCovariance.optional(),
    /** An ambiguous fix's other solution (mirror or second crossing), local metres, kept so the log never loses it. */
    alternative: z.object({ eastMeters: z.number(), northMeters: z.number(), upMeters: z.number() }).optional(),
    ellipse: z
      .object({
        semiMajorMeters: z.number().nonnegative(),
        semiMinorMeters: z.number().nonnegative(),
        majorAxisDegreesFromEast: z.number(),
        confidence: z.number().gt(0).lt(1),
      })
      .optional(),
    residualRmsSeconds: z.number().nonnegative().optional(),
    pairsUsed: z.number().int().nonnegative(),
    bandHz: frequencyBandSchema.optional(),
    label,
    note: z.string().max(MAX_NOTE_CHARS),
    accepted: z.boolean(),
    warnings: z.array(z.string().max(MAX_NOTE_CHARS)).max(PROJECT_LIMITS.warningsPerFix).optional(),
  });

function checkPositionComplete(entry: { eastMeters?: number; northMeters?: number; upMeters?: number }, context: z.RefinementCtx): void {
  const given = [entry.eastMeters, entry.northMeters, entry.upMeters].filter((value) => value !== undefined).length;
  if (given !== 0 && given !== 3) {
    context.addIssue({ code: 'custom', path: ['eastMeters'], message: 'a position needs all of eastMeters, northMeters and upMeters, or none of them' });
  }
}

export const fixLogEntrySchemaV2 = fixLogEntryFieldsV2.superRefine(checkPositionComplete);

/**
 * A fix's own quality figures as the survey log writes them (version 3 on), kept so an export of the log names them for
 * every fix, whichever recording it came from. Absent in fixes logged with version 2.
 */
export const fixQualitySchema = z.object({
  /** Smallest ratio of a pair's correlation peak to its second peak (survey log `min_peak_ratio`). */
  minPeakRatio: z.number().nonnegative().optional(),
  gdop: z.number().nonnegative().optional(),
  chiSquare: z.number().nonnegative().optional(),
  chiSquareDof: z.number().int().nonnegative().optional(),
  timingSigmaSeconds: z.number().nonnegative().optional(),
  sigmaSource: z.string().max(MAX_LABEL_CHARS).optional(),
  bandSnrDb: z.number().optional(),
  medianPairSnrDb: z.number().optional(),
  channelsTriggered: z.number().int().nonnegative().optional(),
  /** Pairs the fix left out, "1-3 2-4" (1-based microphone numbers). */
  pairsDropped: z.string().max(MAX_NOTE_CHARS).optional(),
  eventFlags: z.string().max(MAX_NOTE_CHARS).optional(),
  /** What the ellipse is made of (survey log `ellipse_terms`). */
  ellipseTerms: z.string().max(MAX_NOTE_CHARS).optional(),
});

/** Version 3: each fix names the recording it came from and keeps its own quality figures. */
export const fixLogEntrySchema = fixLogEntryFieldsV2
  .extend({
    recording: recordingIdentitySchema,
    quality: fixQualitySchema.optional(),
    /** The array's WGS84 origin when the fix was logged: its latitude and longitude stay right after the array changes. */
    origin: geodeticOriginSchema.optional(),
  })
  .superRefine(checkPositionComplete);

export const mapViewSchema = z.object({
  centerEastMeters: z.number(),
  centerNorthMeters: z.number(),
  metersPerPixel: z.number().positive(),
});

function checkFixIdsUnique(document: { fixes: ReadonlyArray<{ id: string }> }, context: z.RefinementCtx): void {
  const seen = new Set<string>();
  document.fixes.forEach((entry, index) => {
    if (seen.has(entry.id)) context.addIssue({ code: 'custom', path: ['fixes', index, 'id'], message: `fix id '${entry.id}' is used twice; each fix needs its own id` });
    seen.add(entry.id);
  });
}

/** The fields every schema version from 2 on has before the fix log, in file order (keys are written in schema order). */
const documentHeadFields = {
  name: z.string().max(MAX_LABEL_CHARS),
  /** The Whence that last saved the file (e.g. "Whence 0.1.0"); set when the document is serialized. */
  writtenBy: z.string().max(MAX_LABEL_CHARS).optional(),
  array: arraySchema,
  medium: mediumSchema,
  settings: settingsSchema,
  recording: recordingReferenceSchema.optional(),
};

export const projectDocumentSchemaV2 = z
  .object({
    schemaVersion: z.literal(2),
    ...documentHeadFields,
    fixes: z.array(fixLogEntrySchemaV2).max(PROJECT_LIMITS.fixes),
    view: mapViewSchema.optional(),
  })
  .superRefine(checkFixIdsUnique);

/** Version 3: every logged fix carries its recording's identity and its own quality figures. */
export const projectDocumentSchemaV3 = z
  .object({
    schemaVersion: z.literal(3),
    ...documentHeadFields,
    fixes: z.array(fixLogEntrySchema).max(PROJECT_LIMITS.fixes),
    view: mapViewSchema.optional(),
    /** A picture of the site drawn under the map (optional; a file without it loads as before). */
    sitePicture: sitePictureSchema.optional(),
  })
  .superRefine(checkFixIdsUnique);
