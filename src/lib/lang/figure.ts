/**
 * `plot #9 #35 [xlabel="…"] [ylabel="…"]`: a figure overlaying the tables of earlier steps. The line checks
 * that each step exists in the pad and answers a `figure` result naming them; the console and transcripts draw
 * it from the steps' own tables (src/lib/client/figure/spec.ts), so nothing is copied or recomputed here.
 */
import type * as A from './ast';
import type { LineEnv, StatementOut } from './env';
import { LangError } from './errors';
import type { FigureResult } from './result';
import { resolveValue } from './values';

const LABEL_KEYS = ['xlabel', 'ylabel'] as const;

export function runPlot(s: A.PlotStmt, env: LineEnv): StatementOut {
	for (const r of s.refs) {
		if (!Object.prototype.hasOwnProperty.call(env.ctx.refs ?? {}, r.step)) {
			throw new LangError(`no step #${r.step} in this pad to plot`, r.start, r.end, {
				hint: 'plot the tables of earlier steps: plot #2 #5'
			});
		}
	}
	const fig: FigureResult = {
		kind: 'figure',
		label: `figure of ${s.refs.map((r) => `#${r.step}`).join(', ')}`,
		steps: s.refs.map((r) => r.step)
	};
	const scope = { ctx: env.ctx, lets: env.lets, bulk: env.bulk.params };
	for (const kv of s.keys) {
		if (!(LABEL_KEYS as readonly string[]).includes(kv.key)) {
			throw new LangError(`plot takes xlabel="…" and ylabel="…", not ${kv.key}`, kv.keySpan.start, kv.keySpan.end);
		}
		const v = resolveValue(kv.value, scope, env.limits);
		if (v.many || typeof v.value !== 'string' || v.value.length > 120) {
			throw new LangError(`${kv.key} is LaTeX in quotes, e.g. ${kv.key}="\\Delta A"`, kv.value.start, kv.value.end);
		}
		fig[kv.key as (typeof LABEL_KEYS)[number]] = v.value;
	}
	return { results: [fig] };
}
