/** Messages between the server and an evaluation process (child.ts), over Node's IPC channel with structured clone. */
import type { PadContext } from '../../lang/result';
import type { EvalAnswer } from './worker';

export interface DatasetRows {
	columns: string[];
	rows: number[][];
}

export interface DatasetText {
	id: string;
	columns: string;
	rows: string;
}

export type ToChild = {
	type: 'run';
	id: number;
	input: string;
	/** the pad context without datasets: those travel once per process, by id */
	ctx: PadContext;
	/** dataset name → id, for the datasets this line names */
	datasets: Record<string, string>;
	/** names of the owner's other datasets, so "did you mean" still works without their rows */
	otherDatasets: string[];
	/** datasets this process does not hold yet, as their stored JSON text (parsed here, not on the server) */
	load: DatasetText[];
	/** ids this process may forget (the server keeps its cache within a byte budget) */
	evict: string[];
};

export type FromChild =
	| { type: 'ready' }
	| { type: 'started'; id: number }
	| { type: 'progress'; id: number; done: number; total: number }
	| { type: 'answer'; id: number; answer: EvalAnswer };
