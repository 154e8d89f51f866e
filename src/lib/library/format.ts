/**
 * Small formatting rules shared by the library, dataset and key pages and the server, so a name the page
 * suggests is the name the server accepts.
 */

/** Sizes as the upload form and the API's messages show them (decimal units, like file managers). */
export function formatBytes(n: number): string {
	if (n < 1000) return `${n} B`;
	if (n < 1_000_000) return `${(n / 1000).toFixed(n < 10_000 ? 1 : 0)} kB`;
	return `${(n / 1_000_000).toFixed(2)} MB`;
}

/** The language reads `compare <name>` as a plain name: letters, digits and `_`, starting with a letter. */
export const DATASET_NAME = /^[a-z][a-z0-9_]*$/;
export const DATASET_NAME_MAX = 40;

/** `Lattice d=4 (v2).csv` → `lattice_d_4_v2`: a usable name when the uploader gives none. */
export function nameFromFile(fileName: string): string {
	const stem = fileName.replace(/\.[^.]*$/, '').toLowerCase();
	let name = stem
		.replace(/[^a-z0-9_]+/g, '_')
		.replace(/_+/g, '_')
		.replace(/^_+|_+$/g, '');
	if (!/^[a-z]/.test(name)) name = 'data_' + name;
	return name.slice(0, DATASET_NAME_MAX).replace(/_+$/, '') || 'data';
}

/** `l=1 c=12`: how a macro's parameters read at the call site. */
export function callExample(name: string, params: Record<string, string>): string {
	const keys = Object.entries(params).map(([k, v]) => `${k}=${/\s/.test(v) ? JSON.stringify(v) : v}`);
	return ['@' + name, ...keys].join(' ');
}

/** Parameters typed one per line as `name=default` (a default may contain spaces and '='). */
export function readParamLines(text: string): { params: Record<string, string>; problem: string | null } {
	const params: Record<string, string> = {};
	const lines = text.split('\n');
	for (let i = 0; i < lines.length; i++) {
		const line = lines[i]!.trim();
		if (line === '') continue;
		const eq = line.indexOf('=');
		if (eq <= 0) return { params, problem: `parameter line ${i + 1}: write name=default, e.g. l=0.4` };
		const name = line.slice(0, eq).trim();
		if (name in params) return { params, problem: `parameter '${name}' is given twice` };
		params[name] = line.slice(eq + 1).trim();
	}
	return { params, problem: null };
}

export function paramLines(params: Record<string, string>): string {
	return Object.entries(params)
		.map(([k, v]) => `${k}=${v}`)
		.join('\n');
}
