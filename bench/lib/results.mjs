// Shared by the bench scripts: print one JSON line per figure, and keep one section per bench in
// bench/RESULTS.md (replaced in place on each run, so the file always shows the latest figures).
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';

export const RESULTS = 'bench/RESULTS.md';

export function emit(figure) {
	console.log(JSON.stringify(figure));
}

export function machineLine() {
	return `${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, Node ${process.version}, ${new Date().toISOString().slice(0, 10)}`;
}

export function writeSection(name, markdown) {
	const start = `<!-- bench:${name} -->`;
	const end = `<!-- /bench:${name} -->`;
	const block = `${start}\n${markdown.trim()}\n${end}`;
	let text = existsSync(RESULTS)
		? readFileSync(RESULTS, 'utf8')
		: '# Bench results\n\nWritten by `npm run bench -- <name>`; each section is replaced when its bench runs again.\n';
	const i = text.indexOf(start);
	const j = text.indexOf(end);
	text = i >= 0 && j > i ? text.slice(0, i) + block + text.slice(j + end.length) : `${text.trimEnd()}\n\n${block}\n`;
	writeFileSync(RESULTS, text);
}

export function median(xs) {
	const s = [...xs].sort((a, b) => a - b);
	const m = s.length >> 1;
	return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}
