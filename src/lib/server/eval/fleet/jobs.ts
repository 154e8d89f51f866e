/** What travels through the fleet's queues: a job's data and a worker's answer. */
import type { PadContext } from '../../../lang/result';
import type { DatasetRef, PoolAnswer } from '../pool';
import type { DatasetText } from '../protocol';

/** BullMQ job data: the code version in the clear (a worker checks it before anything else), the rest encoded. */
export interface FleetJobData {
	version: string;
	/** codec.ts's encoding of a FleetPayload */
	payload: string;
}

export interface FleetPayload {
	input: string;
	ctx: PadContext;
	datasets: DatasetRef[];
	otherDatasets: string[];
	/** the named datasets' stored rows: a worker has no database to read them from */
	texts: DatasetText[];
	budgetMs: number;
}

/** A worker's answer (the pool's, as in-process), encoded by codec.ts as the job's return value. */
export type FleetAnswer = PoolAnswer;
