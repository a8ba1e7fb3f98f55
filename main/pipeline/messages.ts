// Messages between the command line and its locate workers (worker_threads): plain data only.
import type { DeploymentLayout, RecorderClock } from '../../core/deployment';
import type { DetectedEvent } from '../../core/detect';
import type { LocateContext, MeasuredEvent } from '../../core/pipeline';

/** A deployment (core/deployment) instead of one file: its table's path (files are relative to it), layout and clocks. */
export interface WorkerDeployment { tablePath: string; layout: DeploymentLayout; clocks: RecorderClock[] }
export interface WorkerInit { recordingPath: string; context: LocateContext; deployment?: WorkerDeployment }
export type ToWorker = { kind: 'locate'; id: number; event: DetectedEvent } | { kind: 'stop' };
export type FromWorker = { kind: 'ready' } | { kind: 'measured'; id: number; measured: MeasuredEvent } | { kind: 'failed'; id: number; message: string; code: string | undefined };
