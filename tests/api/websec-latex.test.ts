// A hostile pad, imported through the API with crafted formulas, labels and inputs, exported to .tex and
// compiled with pdflatex as a collaborator would — by default and with shell escape ON. The compile must
// succeed, read no file but its own and TeX's, and run nothing. pdflatex comes from Debian's texlive-latex-base
// (scripts/ensure-texlive.mjs installs it for `npm test`); without it this file fails, it is never skipped.
import { execFile, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { beforeAll, describe, expect, it } from 'vitest';
import { freshMember, type Client } from '../helpers/client';
import { hostileFormulas } from '../helpers/hostile-tex';

const run = promisify(execFile);
const work = mkdtempSync(join(tmpdir(), 'bulkpad-websec-tex-'));
/** A file the attack tries to read: digits only, so the PDF check does not depend on kerning splitting it. */
const secretFile = join(work, 'secret.txt');
const secret = String(Math.floor(1e13 + Math.random() * 8e13));
const marker = join(work, 'pwned');

let member: Client;
let tex: string;

/** The pdflatex run: its exit, stdout, log, the files it opened (-recorder) and the uncompressed PDF's text. */
async function compile(name: string, source: string, shellEscape: boolean) {
	const dir = mkdtempSync(join(work, `${name}-`));
	writeFileSync(join(dir, `${name}.tex`), source);
	// uncompressed streams so text typeset from a read file would be visible in the PDF bytes
	const args = [
		'-interaction=nonstopmode',
		'-halt-on-error',
		'-recorder',
		shellEscape ? '-shell-escape' : '-no-shell-escape',
		`-jobname=${name}`
	];
	args.push(`\\pdfcompresslevel=0 \\pdfobjcompresslevel=0 \\input{${name}.tex}`);
	const out = await run('pdflatex', args, { cwd: dir, maxBuffer: 16 << 20 }).then(
		(r) => ({ code: 0, stdout: r.stdout }),
		(e: { code?: number; stdout?: string }) => ({ code: e.code ?? 1, stdout: e.stdout ?? '' })
	);
	const read = (f: string) => (existsSync(join(dir, f)) ? readFileSync(join(dir, f), 'latin1') : '');
	const fls = read(`${name}.fls`);
	return {
		...out,
		log: read(`${name}.log`),
		pdf: read(`${name}.pdf`),
		inputs: fls
			.split('\n')
			.filter((l) => l.startsWith('INPUT '))
			.map((l) => l.slice(6)),
		outputs: fls
			.split('\n')
			.filter((l) => l.startsWith('OUTPUT '))
			.map((l) => l.slice(7))
	};
}

beforeAll(async () => {
	if (spawnSync('pdflatex', ['--version']).status !== 0) {
		throw new Error(
			'pdflatex is missing: run "node scripts/ensure-texlive.mjs" (installs texlive-latex-base) — this test is never skipped.'
		);
	}
	writeFileSync(secretFile, `${secret}\n`);
	member = await freshMember('tex-attacker');
	const formulas = hostileFormulas(secretFile, marker);
	const attack = `\\input{${secretFile}}`;
	const results = [
		...formulas.map((latex, i) => ({
			kind: 'scalar',
			label: `${attack} ${i}`,
			value: 1,
			order: 2,
			latex,
			unit: `\\immediate\\write18{touch ${marker}}`
		})),
		{ kind: 'series', label: attack, terms: [{ k: 2, coeff: 0.5, latex: formulas[0] }], latex: formulas[4] },
		{ kind: 'record', label: 'r', fields: { [attack]: 1 }, latex: formulas[2], warning: formulas[6] },
		{ kind: 'table', label: 't', columns: [attack, '$x$'], rows: [[attack, 1]] },
		{ kind: 'note', text: `\\end{itemize}${attack}` },
		// an honest formula still compiles as math beside them
		{
			kind: 'scalar',
			label: 'ΔA',
			value: 0.0245,
			order: 2,
			latex: '\\Delta A = \\frac{\\sqrt{\\pi}\\,\\Gamma(\\tfrac{1}{4})^2}{32\\pi}\\,\\ell^{2}'
		}
	];
	const doc = {
		format: 'bulkpad-pad',
		version: 1,
		title: `${attack} ^^5cinput`,
		bulk: { name: 'brane', params: { d: 4, zh: 1 } },
		units: { system: 'geo', G: 1 },
		steps: [
			{ n: 1, input: `darea l=0.3 // \\end{verbatim}${attack}`, status: 'ok', results, error: null },
			{ n: 2, input: 'x', status: 'error', results: null, error: { message: `\\immediate\\write18{touch ${marker}}${attack}` } }
		]
	};
	// a TeX payload in a bulk parameter never gets as far as the export: import checks bulks with the language's schemas
	const hostileBulk = { ...doc, bulk: { name: 'brane', params: { d: 4, zh: 1, x: `\\write18{touch ${marker}}` } } };
	const refused = await member.post('/api/pads/import', hostileBulk);
	expect(refused.status).toBe(400);
	expect(refused.body.error.message).toMatch(/key 'x' does not apply/);
	const imported = await member.post('/api/pads/import', doc);
	expect(imported.status, JSON.stringify(imported.body)).toBe(201);
	const exported = await member.get(`/api/pads/${imported.body.pad.id}/export?format=tex`);
	expect(exported.status).toBe(200);
	tex = exported.body as string;
});

describe('the control: this pdflatex would fall for an unescaped attack', () => {
	// without it, "nothing was read or run" below could mean the attack was never possible here
	it('reads the secret and runs a command when the TeX asks and shell escape is on', { timeout: 180_000 }, async () => {
		const controlMarker = join(work, 'control-ran');
		const r = await compile(
			'control',
			`\\documentclass{article}\\begin{document}\\input{${secretFile}}\\immediate\\write18{touch ${controlMarker}}\\end{document}\n`,
			true
		);
		expect(r.code, r.stdout.slice(-1500)).toBe(0);
		expect(r.inputs).toContain(secretFile);
		expect(r.pdf).toContain(secret);
		expect(existsSync(controlMarker)).toBe(true);
	});
});

describe.each([
	['default (no shell escape)', false],
	['shell escape ON', true]
])('the hostile pad compiled with %s', (_, shellEscape) => {
	let r: Awaited<ReturnType<typeof compile>>;
	beforeAll(async () => {
		r = await compile(shellEscape ? 'hostile-escape' : 'hostile', tex, shellEscape);
	}, 180_000);

	it('compiles', () => {
		expect(r.code, r.stdout.slice(-2000)).toBe(0);
		expect(r.stdout).toMatch(/Output written on hostile(-escape)?\.pdf/);
	});

	it('reads no file of the attacker’s choosing', () => {
		// its own .tex and .aux (relative), TeX's own trees and its font cache (bitmap fonts made on first use)
		const texTrees = /^\/(usr\/share\/(texlive|texmf|fonts)|var\/lib\/texmf|etc\/texmf)\/|\/\.texlive\d+\/texmf-var\//;
		expect(r.inputs.filter((f) => !texTrees.test(f) && !/^(\.\/)?hostile(-escape)?\.(tex|aux)$/.test(f))).toEqual([]);
		expect(r.inputs).not.toContain(secretFile);
		expect(r.pdf).not.toContain(secret);
		expect(r.log).not.toContain(secret);
	});

	it('runs nothing and writes only its own files', () => {
		expect(existsSync(marker)).toBe(false);
		expect(r.log).not.toMatch(/runsystem/);
		expect(r.outputs.every((f) => /^hostile(-escape)?\.(log|aux|pdf|fls)$/.test(f))).toBe(true);
	});

	it('shows the attacks as text and typesets the honest formula as math', () => {
		// \texttt{} of the refused formulas: the attack's words are printed, escaped
		expect(tex).toContain(`\\texttt{\\textbackslash{}input\\{${secretFile}\\}}`);
		expect(tex).toContain('\\Delta A = \\frac{\\sqrt{\\pi}');
		expect(r.log).not.toMatch(/^! /m);
	});
});
