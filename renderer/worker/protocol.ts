// Messages between the workspace (UI thread) and its pipeline worker: requests with ids, progress, results, cancel,
// and byte reads the worker asks of the UI thread when the recording lives behind the desktop host.
import type { WavInfo } from '../../core/audio';
import type { DeploymentClockReport, DeploymentLayout } from '../../core/deployment';
import type { ArrayGeometry } from '../../core/project';
import type { SpanCorrelationParams } from './spanCorrelations';

/**
 * A deployment: its table, and the files the user picked, each by its path relative to the picked folder (the folder's
 * own name removed) or its bare name when single files were picked; the table's files are matched to them by path, else name
 * (core/deployment matchPickedFiles). `table.name` may be the table's own path in the picked folder ('site/deployment.csv'):
 * the table's relative paths then start from its folder.
 */
export type WorkerSource =
  | { kind: 'blob'; blob: Blob; name: string }
  | { kind: 'proxy'; name: string; sizeBytes: number }
  | { kind: 'deployment'; table: { name: string; text: string }; files: Array<{ path: string; blob: Blob }>; nameTime?: string };

/** What `open` resolves to: the recording's (for a deployment its virtual recording's) header and content hash, and the deployment's layout. */
export interface WorkerOpenResult { info: WavInfo; contentHash: string; deployment?: DeploymentLayout }

/**
 * Fits the open deployment's clocks as `whence sync` does (same defaults): from a calibration table (calibration sounds at
 * surveyed points, `--calibration`), or from a shared-sound table (sounds every recorder heard at unknown places, fitted
 * with their places and times, `--shared-sounds`) steadied by the offset prior (`--offset-sigma`). Give exactly one table.
 */
export type SyncClocksParams = ClockFitCommonParams & (
  | { calibration: { name: string; text: string }; sharedSounds?: undefined }
  | {
    sharedSounds: { name: string; text: string };
    calibration?: undefined;
    /** One-sigma of every recorder's offset prior, seconds (0.0001 to 3600); default by its first file's stamp: 1 s to the sample, 2 s whole-second. */
    offsetSigmaSeconds?: number;
    /** 3: each sound's height fitted (default when the microphones differ in height by 0.1 m or more); 2: fixed at soundUpMeters. */
    dimensions?: 2 | 3;
    /** 2-D: the sounds' height, metres up (default the microphones' mean height). */
    soundUpMeters?: number;
  });

/** What every clock fit takes, whichever its table. */
export interface ClockFitCommonParams {
  geometry: ArrayGeometry;
  speedMetersPerSecond: number;
  /** Recorder whose clock is the time base (default: the table's first). */
  referenceRecorder?: string;
  /** Correlation band (default 300 Hz to 0.45 of the sample rate). */
  bandHz?: { lowHz: number; highHz: number };
  /** How far from its rough time a calibration sound is looked for, seconds (default 3). */
  searchSeconds?: number;
}

export interface WorkerRequestMap {
  open: { source: WorkerSource };
  /** Needs an open deployment; afterwards every read goes through the fitted clocks. */
  syncClocks: SyncClocksParams;
  /** Back to each recorder's own file stamps; needs an open deployment. */
  clearClocks: Record<string, never>;
  /** Correlation plots of a span; for a deployment each pair's delay is aligned at `atSeconds` (default the span's start), or per channel at `channelSeconds`. */
  correlations: SpanCorrelationParams;
}

export interface WorkerResultMap {
  open: WorkerOpenResult;
  syncClocks: DeploymentClockReport;
  clearClocks: null;
}

export type ToWorker =
  | { kind: 'request'; requestId: number; method: string; params: unknown }
  | { kind: 'cancel'; requestId: number }
  | { kind: 'bytes'; readId: number; bytes?: Uint8Array; error?: string };

export type FromWorker =
  | { kind: 'progress'; requestId: number; progress: unknown }
  | { kind: 'result'; requestId: number; result: unknown }
  | { kind: 'error'; requestId: number; code: string; message: string }
  | { kind: 'read'; readId: number; offsetBytes: number; lengthBytes: number };
