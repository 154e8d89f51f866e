/**
 * Figure labels are LaTeX (`\Delta A`, `\ell`, `z_h`): the same source goes verbatim into a pgfplots file and is
 * drawn on screen, in SVG/PNG and in PDF as plain runs of text (Greek mapped to Unicode, sub- and superscripts
 * shifted). Only a small label vocabulary is understood; anything else is shown as typed, and a label that is
 * not safe to hand to pdflatex is escaped into text mode instead (`texForPgf`).
 */

/** A run of label text: `shift` −1 subscript, +1 superscript; `italic` for single-letter math symbols. */
export interface LabelRun {
	text: string;
	shift: -1 | 0 | 1;
	italic: boolean;
}

const GREEK: Record<string, string> = {
	alpha: 'α',
	beta: 'β',
	gamma: 'γ',
	delta: 'δ',
	epsilon: 'ε',
	varepsilon: 'ε',
	zeta: 'ζ',
	eta: 'η',
	theta: 'θ',
	kappa: 'κ',
	lambda: 'λ',
	mu: 'μ',
	nu: 'ν',
	xi: 'ξ',
	pi: 'π',
	rho: 'ρ',
	sigma: 'σ',
	tau: 'τ',
	phi: 'φ',
	chi: 'χ',
	psi: 'ψ',
	omega: 'ω',
	Gamma: 'Γ',
	Delta: 'Δ',
	Theta: 'Θ',
	Lambda: 'Λ',
	Pi: 'Π',
	Sigma: 'Σ',
	Phi: 'Φ',
	Psi: 'Ψ',
	Omega: 'Ω',
	ell: 'ℓ',
	partial: '∂',
	infty: '∞',
	chi2: 'χ²'
};
const SYMBOLS: Record<string, string> = {
	cdot: '·',
	times: '×',
	pm: '±',
	le: '≤',
	leq: '≤',
	ge: '≥',
	geq: '≥',
	approx: '≈',
	to: '→',
	sim: '∼',
	propto: '∝',
	',': ' ',
	';': ' ',
	quad: '  ',
	'%': '%',
	'#': '#',
	_: '_',
	'&': '&',
	'{': '{',
	'}': '}',
	' ': ' ',
	langle: '⟨',
	rangle: '⟩'
};
/** Commands whose one argument is shown upright (`\mathrm{fin}`) */
const UPRIGHT = new Set(['mathrm', 'text', 'textrm', 'operatorname', 'mathsf']);

/** The control words `texForPgf` lets through to pdflatex: the label vocabulary above, nothing that reads files. */
const SAFE_WORDS = new Set([...Object.keys(GREEK).filter((k) => k !== 'chi2'), ...Object.keys(SYMBOLS), ...UPRIGHT, 'frac', 'sqrt']);

/** Parses `src` into runs. Braces group; `^`/`_` take one character or a group; unknown commands show as typed. */
export function labelRuns(src: string): LabelRun[] {
	const out: LabelRun[] = [];
	let i = 0;
	const push = (text: string, shift: -1 | 0 | 1, italic: boolean) => {
		const last = out[out.length - 1];
		if (last && last.shift === shift && last.italic === italic) last.text += text;
		else out.push({ text, shift, italic });
	};
	/** one atom at `i`: a group, a command, or one character; written with `shift` */
	function atom(shift: -1 | 0 | 1, upright: boolean, depth: number) {
		const ch = src[i]!;
		if (ch === '{') {
			i++;
			while (i < src.length && src[i] !== '}') step(shift, upright, depth + 1);
			i++;
			return;
		}
		if (ch === '\\') {
			const m = /^\\([A-Za-z]+|.)/.exec(src.slice(i));
			const word = m ? m[1]! : '\\';
			i += word.length + 1;
			if (word in GREEK) return push(GREEK[word]!, shift, false);
			if (word in SYMBOLS) return push(SYMBOLS[word]!, shift, false);
			if (UPRIGHT.has(word)) {
				while (src[i] === ' ') i++;
				if (i < src.length) atom(shift, true, depth + 1);
				return;
			}
			return push(word, shift, false);
		}
		i++;
		if (ch === '$') return;
		if (ch === '~') return push(' ', shift, false);
		if (ch === ' ' && !upright) return; // math mode ignores spaces
		push(ch, shift, !upright && /[A-Za-z]/.test(ch));
	}
	function step(shift: -1 | 0 | 1, upright: boolean, depth: number) {
		const ch = src[i]!;
		if ((ch === '^' || ch === '_') && depth < 8) {
			i++;
			if (i < src.length) atom(ch === '^' ? 1 : -1, upright, depth + 1);
			return;
		}
		atom(shift, upright, depth);
	}
	while (i < src.length) step(0, false, 0);
	return out;
}

/** The label as one line of plain text (`Δ A`, `z_h` → "ΔA", "zh" with sub/sup marks): for titles and readouts. */
export function labelText(src: string): string {
	return labelRuns(src)
		.map((r) => (r.shift === -1 ? `_${r.text}` : r.shift === 1 ? `^${r.text}` : r.text))
		.join('');
}

/**
 * The label for a pgfplots file, inside `$…$`. A label using only the vocabulary above (and balanced braces)
 * goes through as typed; anything else is set as escaped text, so a label can never break the document or
 * reach a file or shell command.
 */
export function texForPgf(src: string): string {
	const words = [...src.matchAll(/\\([A-Za-z]+|.)/g)].map((m) => m[1]!);
	let depth = 0;
	let balanced = true;
	for (const ch of src.replace(/\\[{}]/g, '')) {
		if (ch === '{') depth++;
		if (ch === '}' && --depth < 0) balanced = false;
	}
	const ok =
		balanced && depth === 0 && words.every((w) => SAFE_WORDS.has(w)) && !/[$%#&~]/.test(src.replace(/\\[%#&]/g, '')) && src.length <= 200;
	if (ok) return `$${src}$`;
	return src.replace(/[\\{}$&#^_%~]/g, (c) => (c === '\\' ? '\\textbackslash{}' : c === '^' ? '\\^{}' : c === '~' ? '\\~{}' : `\\${c}`));
}

/** Unicode from the engine's labels (ΔA, ℓ, z_h) into LaTeX label source. */
const FROM_UNICODE: Record<string, string> = Object.fromEntries(
	Object.entries(GREEK)
		.filter(([k]) => k !== 'chi2' && k !== 'varepsilon')
		.map(([k, v]) => [v, `\\${k} `])
);

export function unicodeToTex(s: string): string {
	return [...s]
		.map((c) => FROM_UNICODE[c] ?? (c === '·' ? '\\cdot ' : c === '−' ? '-' : c === '²' ? '^2' : c === '³' ? '^3' : c))
		.join('')
		.replace(/ +$/, '')
		.replace(/\\([A-Za-z]+) (?=[^A-Za-z]|$)/g, '\\$1');
}

/** Default axis labels per swept key (LANGUAGE.md's keys); unknown keys are set upright. */
const KEY_LABELS: Record<string, string> = {
	l: '\\ell',
	R: 'R',
	gap: '\\mathrm{gap}',
	zh: 'z_h',
	zp: 'z_p',
	z0: 'z_0',
	zstar: 'z_*',
	v: 'v',
	rapidity: '\\eta',
	q: 'q',
	d: 'd',
	p: 'p',
	t: 't',
	o: '\\mathrm{order}\\;n',
	order: '\\mathrm{order}\\;n',
	k: 'k'
};

export function keyLabel(key: string): string {
	return KEY_LABELS[key] ?? (key.length === 1 ? key : `\\mathrm{${key.replace(/[^A-Za-z0-9]/g, '')}}`);
}

/**
 * The y label from a table label "ΔA vs l · boosted d=4 …": the quantity before " vs ", in LaTeX. A label
 * with no " vs " (a comparison, an overlay) gives its first word.
 */
export function quantityLabel(tableLabel: string): string {
	const head = tableLabel.split(' vs ')[0]!.split(' · ')[0]!.trim();
	return unicodeToTex(head.length > 30 ? head.slice(0, 30) : head);
}

/** Legend text for a column (`o3` → order 3), prefixed with its step in an overlay. */
export function columnLegend(column: string, step?: number): string {
	const m = /^o(\d+)$/.exec(column);
	const base = m ? `\\mathrm{order}\\;${m[1]}` : `\\mathrm{${column.replace(/[^A-Za-z0-9_]/g, '').replace(/_/g, '\\_')}}`;
	return step === undefined ? base : `\\#${step}\\;${base}`;
}
