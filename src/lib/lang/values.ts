/**
 * Turns the values of key=value into numbers, orders and strings. Names in arithmetic are resolved in this
 * order: the constants pi and e, then the bulk's numeric keys (so `l=2*zh/3` means two thirds of the line's
 * zh), then the pad's let-names; `#n` and `#n.field` read earlier steps. Bulk keys on a line are evaluated
 * against the pad's bulk and the line's other keys against the resulting bulk, so no evaluation order
 * between keys of one line can form a cycle.
 */
import type * as A from './ast';
import { type Resolver, evaluateExpr } from './arith';
import { LangError } from './errors';
import { type Limits, limitError } from './limits';
import type { LetValue, Order, PadContext } from './result';
import { getOwn } from './own';
import { didYouMean } from './suggest';

export type Scalar = number | string | 'exact';

/** A key's value: one value, or several (a list or a range) that the line sweeps over. */
export type Resolved = { many: false; value: Scalar } | { many: true; values: Scalar[] };

export interface Scope {
	ctx: PadContext;
	lets: Record<string, LetValue>;
	/** the bulk's parameters visible to arithmetic */
	bulk: Record<string, number | string>;
}

export function resolverFor(scope: Scope): Resolver {
	return (node) => {
		if (node.type === 'ref') return readRef(scope.ctx, node);
		const b = getOwn(scope.bulk, node.name);
		if (typeof b === 'number') return b;
		const l = getOwn(scope.lets, node.name);
		if (l) {
			if (l.value !== undefined) return l.value;
			const fields = Object.keys(l.fields);
			throw new LangError(`'${node.name}' keeps no single value`, node.start, node.end, {
				hint: fields.length ? `it keeps ${fields.join(', ')}` : 'it gave no number'
			});
		}
		const known = [...Object.keys(scope.lets), ...Object.keys(scope.bulk).filter((k) => typeof scope.bulk[k] === 'number'), 'pi', 'e'];
		throw new LangError(`unknown name '${node.name}'${didYouMean(node.name, known)}`, node.start, node.end, {
			hint: 'names are let-names, the bulk keys and pi, e'
		});
	};
}

/** The step number a reference reads: its own, or the one its name (`#btz`) is given to in this pad. */
export function refStep(ctx: PadContext, r: A.RefExpr): number | undefined {
	if (r.name === undefined) return r.step;
	return getOwn(ctx.names ?? {}, r.name);
}

function readRef(ctx: PadContext, r: A.RefExpr): number {
	const n = refStep(ctx, r);
	if (n === undefined) {
		const names = Object.keys(ctx.names ?? {});
		throw new LangError(`no step named #${r.name} in this pad${didYouMean(r.name!, names)}`, r.start, r.end, {
			hint: names.length ? `named steps: ${names.map((x) => `#${x}`).join(', ')}` : 'name a step from its menu, or use its number'
		});
	}
	const label = r.name === undefined ? `#${n}` : `#${r.name} (#${n})`;
	const step = getOwn(ctx.refs, n);
	if (!step) throw new LangError(`no step ${label} in this pad`, r.start, r.end);
	if (r.field !== undefined) {
		const v = getOwn(step.fields, r.field);
		if (v === undefined) {
			const names = Object.keys(step.fields);
			throw new LangError(`step ${label} has no field '${r.field}'${didYouMean(r.field, names)}`, r.start, r.end, {
				hint: names.length ? `fields of #${r.name ?? n}: ${names.join(', ')}` : `#${r.name ?? n} has no fields`
			});
		}
		return v;
	}
	if (step.value === undefined) {
		const names = Object.keys(step.fields);
		throw new LangError(`step ${label} has no single value`, r.start, r.end, {
			hint: names.length ? `use a field: ${names.map((f) => `#${r.name ?? n}.${f}`).join(', ')}` : 'it gave no number'
		});
	}
	return step.value;
}

/** The order of an earlier value an arithmetic line uses (a series result stays a series result). */
export function orderOfNames(expr: A.Expr, scope: Scope): Order {
	let lowest: Order = 'exact';
	const visit = (e: A.Expr): void => {
		let o: Order | undefined;
		if (e.type === 'ref') {
			const n = refStep(scope.ctx, e);
			o = n === undefined ? undefined : getOwn(scope.ctx.refs, n)?.order;
		} else if (e.type === 'name' && typeof getOwn(scope.bulk, e.name) !== 'number') o = getOwn(scope.lets, e.name)?.order;
		else if (e.type === 'unary') visit(e.arg);
		else if (e.type === 'paren') visit(e.inner);
		else if (e.type === 'binary') {
			visit(e.left);
			visit(e.right);
		} else if (e.type === 'call') e.args.forEach(visit);
		if (typeof o === 'number' && (lowest === 'exact' || o < lowest)) lowest = o;
	};
	visit(expr);
	return lowest;
}

function item(v: A.Item, resolve: Resolver): Scalar {
	if (v.type === 'exact') return 'exact';
	if (v.type === 'string') return v.value;
	return evaluateExpr(v, resolve);
}

/** Evaluate one key's value. Ranges give `points` values with both ends included (default 50). */
export function resolveValue(v: A.Value, scope: Scope, limits: Limits): Resolved {
	const resolve = resolverFor(scope);
	if (v.type === 'list') return { many: true, values: v.items.map((i) => item(i, resolve)) };
	if (v.type !== 'range') return { many: false, value: item(v, resolve) };
	const a = evaluateExpr(v.from, resolve);
	const b = evaluateExpr(v.to, resolve);
	let n = 50;
	if (v.points) {
		n = evaluateExpr(v.points, resolve);
		if (!Number.isInteger(n) || n < 2) {
			throw new LangError('the number of range points must be a whole number ≥ 2', v.points.start, v.points.end, {
				hint: 'e.g. l=0.1..1:40'
			});
		}
		if (n > limits.maxPoints) {
			throw limitError(
				'maxPoints',
				`a range of ${n} points is more than the ${limits.maxPoints} allowed`,
				v.points.start,
				v.points.end,
				limits
			);
		}
	}
	if (Number.isFinite(a) && Number.isFinite(b) && !Number.isFinite(b - a)) {
		// each point is a + (b − a)·i/(n − 1): a span past the largest double would give NaN points
		throw new LangError('the range is wider than double precision can step through', v.start, v.end, {
			hint: 'narrow it: both ends within ±1e300 of each other'
		});
	}
	const values: number[] = [];
	for (let i = 0; i < n; i++) values.push(i === n - 1 ? b : a + ((b - a) * i) / (n - 1));
	return { many: true, values };
}
