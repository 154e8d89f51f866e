/**
 * Reads the OpenAPI document (/api/openapi.json) into what the API page shows: one entry per operation with
 * its request fields as table rows and an example curl line. Pure, so it is unit-tested without a browser.
 */
type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

export interface FieldRow {
	name: string;
	type: string;
	required: boolean;
	/** limits in words: "1–60 characters", "at most 100000 characters", "1…6000" */
	limits: string;
	description: string;
}

export interface ApiEntry {
	id: string;
	method: string;
	path: string;
	summary: string;
	auth: string;
	description: string;
	/** the request body's media type, when there is a body */
	bodyType?: string;
	/** one table per body variant (a body that is one of several shapes has several) */
	variants: FieldRow[][];
	query: FieldRow[];
	responses: { status: string; description: string }[];
	curl: string;
	group: string;
}

const resolve = (doc: Json, s: Json | undefined): Json => {
	let out = s ?? {};
	for (let i = 0; i < 10 && typeof out.$ref === 'string'; i++) out = doc.components?.schemas?.[out.$ref.split('/').pop()!] ?? {};
	return out;
};

/** A property's type in a few words: `string`, `integer`, `"md" | "tex"`, `string[]`, `date | date-time`. */
export function typeOf(doc: Json, raw: Json): string {
	const s = resolve(doc, raw);
	if (s.const !== undefined) return JSON.stringify(s.const);
	if (Array.isArray(s.enum)) return s.enum.map((v: unknown) => JSON.stringify(v)).join(' | ');
	const alts = s.anyOf ?? s.oneOf;
	if (Array.isArray(alts)) return [...new Set(alts.map((a: Json) => typeOf(doc, a)))].join(' | ');
	if (s.type === 'array') return `${typeOf(doc, s.items ?? {})}[]`;
	if (s.type === 'string' && s.format) return s.format;
	if (Array.isArray(s.type)) return s.type.join(' | ');
	return s.type ?? 'any';
}

function limitsOf(doc: Json, raw: Json): string {
	const s = resolve(doc, raw);
	const words: string[] = [];
	const range = (lo: unknown, hi: unknown, unit = '') => {
		if (lo !== undefined && hi !== undefined) words.push(`${lo}–${hi}${unit}`);
		else if (lo !== undefined) words.push(`at least ${lo}${unit}`);
		else if (hi !== undefined) words.push(`at most ${hi}${unit}`);
	};
	if (s.type === 'string') range(s.minLength, s.maxLength, ' characters');
	if (s.type === 'number' || s.type === 'integer') range(s.minimum, s.maximum);
	if (s.type === 'array') range(s.minItems, s.maxItems, ' items');
	return words.join(', ');
}

/** The rows of an object schema: one per property, required ones first as the schema lists them. */
export function fieldRows(doc: Json, raw: Json | undefined): FieldRow[][] {
	const s = resolve(doc, raw);
	const alts = s.oneOf ?? s.anyOf;
	if (Array.isArray(alts) && !s.properties) return alts.flatMap((a: Json) => fieldRows(doc, a));
	if (!s.properties) return [];
	const required = new Set<string>(s.required ?? []);
	return [
		Object.entries(s.properties as Record<string, Json>).map(([name, p]) => ({
			name,
			type: typeOf(doc, p),
			required: required.has(name),
			limits: limitsOf(doc, p),
			description: resolve(doc, p).description ?? ''
		}))
	];
}

/** A value that fits the schema, for the example: its own example when it gives one. */
export function exampleOf(doc: Json, raw: Json | undefined, depth = 0): unknown {
	const s = resolve(doc, raw);
	if (Array.isArray(s.examples) && s.examples.length) return s.examples[0];
	if (s.const !== undefined) return s.const;
	if (Array.isArray(s.enum)) return s.enum[0];
	const alts = s.anyOf ?? s.oneOf;
	if (Array.isArray(alts) && alts.length) return exampleOf(doc, alts[0], depth + 1);
	switch (s.type) {
		case 'object': {
			if (depth > 4) return {};
			const required: string[] = s.required ?? [];
			return Object.fromEntries(required.map((k) => [k, exampleOf(doc, s.properties?.[k], depth + 1)]));
		}
		case 'array':
			return [];
		case 'integer':
		case 'number':
			return s.minimum ?? 1;
		case 'boolean':
			return true;
		case 'string':
			if (s.format === 'email') return 'you@example.org';
			if (s.format === 'date') return '2030-01-31';
			if (s.format === 'date-time') return '2030-01-31T12:00:00Z';
			return 'x'.repeat(Math.max(1, Math.min(s.minLength ?? 1, 12)));
		default:
			return null;
	}
}

const shellQuote = (s: string) => `'${s.replaceAll("'", "'\\''")}'`;

export function curlOf(origin: string, method: string, path: string, auth: string, body: unknown, bodyType?: string): string {
	const parts = [`curl -s${method === 'GET' ? '' : ` -X ${method}`} "${origin}${path}"`];
	if (auth !== 'public') parts.push('-H "Authorization: Bearer $BULKPAD_KEY"');
	if (bodyType === 'multipart/form-data') parts.push('-F file=@data.csv');
	else if (method !== 'GET') {
		parts.push('-H "content-type: application/json"');
		parts.push(`-d ${shellQuote(JSON.stringify(body ?? {}))}`);
	}
	return parts.join(' \\\n  ');
}

/** Every operation of the document, in the document's order, grouped by the path's second segment. */
export function readApiDocument(doc: Json, origin = doc.servers?.[0]?.url ?? ''): ApiEntry[] {
	const out: ApiEntry[] = [];
	for (const [path, item] of Object.entries((doc.paths ?? {}) as Record<string, Json>)) {
		for (const [method, op] of Object.entries(item)) {
			const content = (op.requestBody?.content ?? {}) as Record<string, Json>;
			const bodyType = Object.keys(content)[0];
			const bodySchema = bodyType ? content[bodyType].schema : undefined;
			const query = (op.parameters ?? []).filter((p: Json) => p.in === 'query');
			const exampleBody = bodyType === 'application/json' ? exampleOf(doc, bodySchema) : undefined;
			// path parameters as shell variables, so the line runs once they are set (curl would glob `{id}`)
			const examplePath = path.replace(/\{([^}]+)\}/g, (_, n: string) => `$${n.toUpperCase()}`);
			out.push({
				id: op.operationId ?? `${method}-${path}`,
				method: method.toUpperCase(),
				path,
				summary: op.summary ?? '',
				auth: op['x-bulkpad-auth'] ?? (op.security?.length ? 'signed-in' : 'public'),
				description: op.description ?? '',
				bodyType,
				variants: bodySchema ? fieldRows(doc, bodySchema) : [],
				query: query.map((p: Json) => ({
					name: p.name,
					type: typeOf(doc, p.schema ?? {}),
					required: !!p.required,
					limits: '',
					description: p.description ?? ''
				})),
				responses: Object.entries((op.responses ?? {}) as Record<string, Json>).map(([status, r]) => ({
					status,
					description: r.description ?? ''
				})),
				curl: curlOf(origin, method.toUpperCase(), examplePath, op['x-bulkpad-auth'] ?? 'signed-in', exampleBody, bodyType),
				group: path.split('/')[2] ?? ''
			});
		}
	}
	return out;
}
