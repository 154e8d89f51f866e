/**
 * Prints syntax trees back to text: `printLine` gives the canonical spelling of a line (one space between
 * words, keys as typed) so two spellings of one line compare equal; `printMathjs` gives the text handed to the
 * sandboxed mathjs instance, with step references renamed to identifiers mathjs accepts but a user cannot type.
 */
import type * as A from './ast';

const PREC: Record<A.BinaryExpr['op'], number> = { '+': 1, '-': 1, '*': 2, '/': 2, '^': 4 };

/**
 * `#4` → `$ref4`, `#4.T` → `$ref4_T`, `#btz` → `$name$btz`, `#btz.T` → `$name$btz$T` ('$' separates a name
 * from its field, since names may contain '_'); '$' never reaches the lexer as part of a name.
 */
export function refIdentifier(step: number, field?: string, name?: string): string {
	if (name !== undefined) return field === undefined ? `$name$${name}` : `$name$${name}$${field}`;
	return field === undefined ? `$ref${step}` : `$ref${step}_${field}`;
}

/** `#4`, `#btz`, `#4.T` as typed. */
export function refText(r: Pick<A.RefExpr, 'step' | 'name' | 'field'>): string {
	const head = `#${r.name ?? r.step}`;
	return r.field === undefined ? head : `${head}.${r.field}`;
}

/** Arithmetic as the user would write it (refs as `#n`). */
export function printExpr(e: A.Expr): string {
	return printWith(e, refText);
}

/** Arithmetic as mathjs text. Every binary operation is parenthesised so mathjs's own precedence rules
 * (e.g. implicit multiplication, unary minus vs '^') can never reinterpret what our parser decided. */
export function printMathjs(e: A.Expr): string {
	return printWith(e, (r) => refIdentifier(r.step, r.field, r.name), true);
}

function printWith(e: A.Expr, ref: (r: A.RefExpr) => string, strict = false, parent = 0): string {
	switch (e.type) {
		case 'number':
			return strict ? String(e.value) : e.raw;
		case 'name':
			return e.name;
		case 'ref':
			return ref(e);
		case 'paren':
			return strict ? printWith(e.inner, ref, strict, 0) : `(${printWith(e.inner, ref, strict, 0)})`;
		case 'unary': {
			const s = `${e.op}${printWith(e.arg, ref, strict, 3)}`;
			return strict ? `(${s})` : parent > 3 ? `(${s})` : s;
		}
		case 'call':
			return `${e.fn}(${e.args.map((a) => printWith(a, ref, strict, 0)).join(', ')})`;
		case 'binary': {
			const p = PREC[e.op];
			// '^' is right-associative: the left side needs brackets at equal precedence, the right does not
			const l = printWith(e.left, ref, strict, e.op === '^' ? p + 1 : p);
			const r = printWith(e.right, ref, strict, e.op === '^' ? p : p + 1);
			const s = e.op === '^' ? `${l}^${r}` : `${l} ${e.op} ${r}`;
			return strict || p < parent ? `(${s})` : s;
		}
	}
}

function printItem(v: A.Item): string {
	if (v.type === 'exact') return 'exact';
	if (v.type === 'string') return `"${v.value.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;
	return printExpr(v);
}

export function printValue(v: A.Value): string {
	if (v.type === 'list') return v.items.map(printItem).join(',');
	if (v.type === 'range') {
		const base = `${printExpr(v.from)}..${printExpr(v.to)}`;
		return v.points ? `${base}:${printExpr(v.points)}` : base;
	}
	return printItem(v);
}

function printKeys(keys: A.KeyValue[]): string[] {
	return keys.map((k) => `${k.key}=${printValue(k.value)}`);
}

function printSinks(sinks: A.Word[]): string[] {
	return sinks.map((s) => `| ${s.text}`);
}

export function printStatement(s: A.Statement): string {
	const parts: string[] = [];
	switch (s.type) {
		case 'use':
			parts.push('use', s.bulk.text, ...printKeys(s.keys));
			break;
		case 'units':
			parts.push('units', s.system.text, ...printKeys(s.keys));
			break;
		case 'let':
			parts.push('let', s.name.text, '=', printStatement(s.body));
			break;
		case 'verb':
			if (s.sweep) parts.push('sweep');
			parts.push(s.verb.text);
			if (s.subject) parts.push(s.subject.text);
			parts.push(...printKeys(s.keys), ...printSinks(s.sinks));
			break;
		case 'compare':
			parts.push('compare', /^[A-Za-z_]\w*$/.test(s.dataset.text) ? s.dataset.text : `"${s.dataset.text}"`);
			if (s.verb) parts.push(s.verb.text);
			parts.push(...printKeys(s.keys), ...printSinks(s.sinks));
			break;
		case 'help':
			parts.push('help', ...(s.topic ? [s.topic.text] : []));
			break;
		case 'plot':
			parts.push('plot', ...s.refs.map((r) => `#${r.step}`), ...printKeys(s.keys));
			break;
		case 'macro':
			parts.push(`@${s.name.text}`, ...printKeys(s.keys));
			break;
		case 'arith':
			parts.push(printExpr(s.expr), ...printSinks(s.sinks));
			break;
	}
	return parts.join(' ');
}

/** The canonical text of a whole line; parse(printLine(parse(x))) has the same meaning as parse(x). */
export function printLine(line: A.Line): string {
	return line.statements.map(printStatement).join('; ');
}

function texRef(e: A.RefExpr): string {
	const head = e.name === undefined ? `\\#${e.step}` : `\\#\\mathrm{${e.name.replace(/_/g, '\\_')}}`;
	return e.field === undefined ? head : `${head}.\\mathrm{${e.field.replace(/_/g, '\\_')}}`;
}

/** Arithmetic as LaTeX for KaTeX: fractions for '/', \cdot for '*', \pi for pi, \#4 for references. */
export function texExpr(e: A.Expr): string {
	switch (e.type) {
		case 'number':
			return /e/i.test(e.raw) ? e.raw.replace(/^(.*?)[eE]([+-]?\d+)$/, (_, m: string, x: string) => `${m}\\times10^{${Number(x)}}`) : e.raw;
		case 'name':
			return e.name === 'pi' ? '\\pi' : e.name.length === 1 ? e.name : `\\mathrm{${e.name.replace(/_/g, '\\_')}}`;
		case 'ref':
			return texRef(e);
		case 'paren':
			return `\\left(${texExpr(e.inner)}\\right)`;
		case 'unary':
			return `${e.op}${texExpr(e.arg)}`;
		case 'call':
			return `\\mathrm{${e.fn}}\\left(${e.args.map(texExpr).join(', ')}\\right)`;
		case 'binary':
			if (e.op === '/') return `\\frac{${texExpr(unparen(e.left))}}{${texExpr(unparen(e.right))}}`;
			if (e.op === '^') return `{${texExpr(e.left)}}^{${texExpr(unparen(e.right))}}`;
			return `${texExpr(e.left)} ${e.op === '*' ? '\\cdot' : e.op} ${texExpr(e.right)}`;
	}
}

function unparen(e: A.Expr): A.Expr {
	return e.type === 'paren' ? e.inner : e;
}
