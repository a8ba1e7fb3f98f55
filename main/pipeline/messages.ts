// Messages between the command line and its locate workers (worker_threads): plain data only.
import type { DetectedEvent } from '../../core/detect';
import type { LocateContext, LocatedEvent } from '../../core/pipeline';

export interface WorkerInit { recordingPath: string; context: LocateContext }
export type ToWorker = { kind: 'locate'; id: number; event: DetectedEvent } | { kind: 'stop' };
export type FromWorker = { kind: 'ready' } | { kind: 'located'; id: number; located: LocatedEvent } | { kind: 'failed'; id: number; message: string; code: string | undefined };
