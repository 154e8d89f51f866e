/**
 * Sorting the keys of a verb line: which override the bulk for this line, which are the verb's quantities,
 * which is swept, and what the orders are. All the "this key does not belong here" messages live here.
 */
import type * as A from './ast';
import { LangError } from './errors';
import type { LineEnv } from './env';
import { limitError } from './limits';
import type { Order } from './result';
import { checkOrder } from './schema';
import { didYouMean } from './suggest';
import { type Resolved, type Scalar, resolveValue } from './values';
import type { VerbForm, VerbSpec } from './verbs/index';
import { ALL_BULK_KEYS, BULK_KEYS, QUANTITY_KEYS, WORD_KEYS, type BulkName, canonicalKey } from './vocab';

export interface SortedKeys {
	form: VerbForm;
	shape: string;
	bulkKeys: A.KeyValue[];
	quantityKeys: A.KeyValue[];
	orderKey?: A.KeyValue;
}

/** The verb's form named by its subject (or the default form) and its keys, sorted. */
export function sortKeys(
	spec: VerbSpec,
	subject: A.Word | undefined,
	keys: A.KeyValue[],
	bulkName: BulkName,
	verbSpan: A.Span
): SortedKeys {
	const verb = spec.name;
	const forms = spec.forms;
	const names = Object.keys(forms);
	const shape = subject?.text ?? names[0]!;
	const form = forms[shape];
	if (!form || (subject && shape === '')) {
		const s = subject!;
		const msg = names[0] === '' ? `${verb} takes no subject` : `${verb} has no form '${s.text}'`;
		throw new LangError(msg, s.start, s.end, names[0] === '' ? {} : { hint: `write ${names.map((n) => `${verb} ${n}`).join(' or ')}` });
	}
	const out: SortedKeys = { form, shape, bulkKeys: [], quantityKeys: [] };
	const own = BULK_KEYS[bulkName];
	for (const kv of keys) {
		const k = canonicalKey(kv.key);
		if (k === 'o' && form.keys.includes('o')) out.orderKey = kv;
		else if (form.keys.includes(k)) out.quantityKeys.push(k === 'along' ? asNames(kv) : asWord(k, kv));
		else if (own.includes(k) || (bulkName === 'metric' && !(QUANTITY_KEYS as readonly string[]).includes(k))) out.bulkKeys.push(kv);
		else throw misplacedKey(spec, shape, kv, bulkName);
	}
	for (const r of form.required) {
		if (!keys.some((kv) => canonicalKey(kv.key) === r)) {
			const what = r === 'o' ? 'a whole order, e.g. o=4' : `${r}=…`;
			const name = `${verb}${shape && shape !== names[0] ? ` ${shape}` : ''}`;
			throw new LangError(`${name} needs ${what}${meaning(r)}`, verbSpan.start, (subject ?? verbSpan).end);
		}
	}
	return out;
}

/** `of=charge`: on a word key a bare name is the word itself, not a let-name (a string "charge" works too). */
function asWord(k: string, kv: A.KeyValue): A.KeyValue {
	if (!(k in WORD_KEYS) || kv.value.type !== 'name') return kv;
	const v = kv.value;
	return { ...kv, value: { type: 'string', value: v.name, start: v.start, end: v.end } };
}

/**
 * `along=m,q`: names of a metric's parameters, not let-names and not a list to sweep over; kept as one string
 * 'm,q' (a string "m,q" works too). Anything else stays as written, so its schema names the problem.
 */
function asNames(kv: A.KeyValue): A.KeyValue {
	const v = kv.value;
	const items = v.type === 'list' ? v.items : [v];
	if (!items.every((x) => x.type === 'name')) return kv;
	const value = items.map((x) => (x as A.NameExpr).name).join(',');
	return { ...kv, value: { type: 'string', value, start: v.start, end: v.end } };
}

function meaning(k: string): string {
	const m: Record<string, string> = {
		l: ' (the strip width)',
		R: ' (the ball radius)',
		gap: ' (the gap between the strips)',
		zstar: ' (the turning point)'
	};
	return m[k] ?? '';
}

function misplacedKey(spec: VerbSpec, shape: string, kv: A.KeyValue, bulkName: BulkName): LangError {
	const verb = spec.name;
	const k = canonicalKey(kv.key);
	const span = kv.keySpan;
	if ((ALL_BULK_KEYS as readonly string[]).includes(k)) {
		const owners = (Object.keys(BULK_KEYS) as BulkName[]).filter((b) => BULK_KEYS[b].includes(k));
		return new LangError(`key '${kv.key}' does not apply to bulk '${bulkName}'`, span.start, span.end, {
			hint: `${bulkName} takes ${BULK_KEYS[bulkName].join(', ')}; '${kv.key}' belongs to ${owners.join(', ')} (use ${owners[0]} …)`
		});
	}
	const forms = spec.forms;
	const other = Object.entries(forms).find(([, f]) => f.keys.includes(k));
	if (other) {
		return new LangError(`${verb} ${shape} takes no key '${kv.key}'`, span.start, span.end, {
			hint: `for that write: ${verb} ${other[0]} ${kv.key}=…`
		});
	}
	const allowed = [...forms[shape]!.keys, ...BULK_KEYS[bulkName]];
	return new LangError(`${verb} takes no key '${kv.key}'${didYouMean(kv.key, allowed)}`, span.start, span.end, {
		hint: `${verb}${shape ? ` ${shape}` : ''} takes ${allowed.join(', ')}`
	});
}

/** Orders of the line: default `exact`; each a whole number ≤ maxOrder or `exact`. */
export function readOrders(kv: A.KeyValue | undefined, r: Resolved | undefined, env: LineEnv): Order[] {
	if (!kv || !r) return ['exact'];
	const values: Scalar[] = r.many ? r.values : [r.value];
	const items = kv.value.type === 'list' ? kv.value.items : undefined;
	return values.map((v, i) => {
		const span = items?.[i] ?? kv.value;
		const c = checkOrder(v);
		if (!c.ok) throw new LangError(c.message, span.start, span.end);
		const o = c.value;
		if (o !== 'exact' && o > env.limits.maxOrder) {
			throw limitError('maxOrder', `order must be ≤ ${env.limits.maxOrder}`, span.start, span.end, env.limits);
		}
		return o;
	});
}

/** Resolve keys, allowing at most one to take several values (the swept key). */
export function resolveKeys(
	keys: A.KeyValue[],
	scope: Parameters<typeof resolveValue>[1],
	env: LineEnv,
	alreadySwept?: A.KeyValue
): { values: Map<A.KeyValue, Resolved>; swept?: A.KeyValue } {
	const values = new Map<A.KeyValue, Resolved>();
	let swept = alreadySwept;
	for (const kv of keys) {
		const r = resolveValue(kv.value, scope, env.limits);
		if (r.many) {
			if (swept) {
				throw new LangError(`only one key may take several values on a line ('${swept.key}' already does)`, kv.value.start, kv.value.end, {
					hint: 'sweep one key per line; orders o=1,2,exact may be listed beside it'
				});
			}
			swept = kv;
		}
		values.set(kv, r);
	}
	return swept ? { values, swept } : { values };
}
