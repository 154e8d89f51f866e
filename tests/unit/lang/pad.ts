/** A tiny pad for tests: runs lines in order and keeps refs, bulk, units and lets as the server would. */
import { emptyContext, runLine, type RunOptions } from '../../../src/lib/lang/evaluate';
import { LangError } from '../../../src/lib/lang/errors';
import type { LineOutcome, PadContext } from '../../../src/lib/lang/result';

export class Pad {
	ctx: PadContext = emptyContext();
	steps: LineOutcome[] = [];

	constructor(extra: Partial<PadContext> = {}) {
		Object.assign(this.ctx, extra);
	}

	/** Runs a line as step #n (n = steps so far + 1) and keeps its state. */
	run(line: string, opts?: RunOptions): LineOutcome {
		const out = runLine(line, this.ctx, opts);
		this.steps.push(out);
		this.ctx = { ...this.ctx, bulk: out.bulk, units: out.units, lets: out.lets, refs: { ...this.ctx.refs, [this.steps.length]: out.ref } };
		return out;
	}

	/** The LangError a line throws (the pad is left as it was). */
	fail(line: string, opts?: RunOptions): LangError {
		try {
			runLine(line, this.ctx, opts);
		} catch (e) {
			if (e instanceof LangError) return e;
			throw e;
		}
		throw new Error(`expected a LangError for ${line}`);
	}
}
