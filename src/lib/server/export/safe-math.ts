/**
 * The math a .tex export may compile, by allow-list. Formulas come from stored results, and an imported file
 * can set those to anything; a collaborator compiles the export, so a formula must not be able to read or
 * write files, run programs, change catcodes or leave math mode. A blocklist misses spellings (\ExplSyntaxOn
 * then \tex_write:D, ^^ escapes, \csname); so every control sequence and every character must be one that
 * Bulkpad's engine emits or KaTeX-style math needs, and the formula must be balanced. Anything else is
 * refused whole, and the exporter prints it as escaped text instead.
 */

/** Control words: the ones Bulkpad emits (src/lib/holo/series, src/lib/lang/{format,printer,sinks,tables}.ts) and common math. */
const WORDS = new Set(
	[
		// Greek
		'alpha beta gamma delta epsilon varepsilon zeta eta theta vartheta iota kappa lambda mu nu xi pi varpi rho varrho',
		'sigma varsigma tau upsilon phi varphi chi psi omega Gamma Delta Theta Lambda Xi Pi Sigma Upsilon Phi Psi Omega',
		// operators and relations
		'cdot times div pm mp ast star circ bullet approx sim simeq cong equiv neq ne leq le geq ge ll gg propto',
		'to rightarrow leftarrow Rightarrow mapsto infty partial nabla sum prod int oint ell hbar prime',
		'ldots cdots dots vdots ddots quad qquad',
		// named functions (upright by TeX's own definitions)
		'sin cos tan cot sec csc sinh cosh tanh coth arcsin arccos arctan log ln exp min max lim sup inf det',
		// delimiters and their sizes
		'left right big Big bigg Bigg bigl bigr Bigl Bigr langle rangle lvert rvert vert Vert lVert rVert lfloor rfloor lceil rceil',
		// fractions, roots, styles, accents
		'frac tfrac dfrac sqrt binom mathrm mathbf mathit mathcal mathsf mathtt boldsymbol text textrm textit mbox',
		'acute hat bar tilde vec dot ddot overline underline widehat widetilde displaystyle textstyle scriptstyle limits nolimits',
		// arrays (the environments are checked by name below)
		'begin end hline operatorname'
	]
		.join(' ')
		.split(' ')
);

/** Control symbols: thin/medium/thick/negative space, a space, a line break in an array, escaped specials. */
const SYMBOLS = new Set([',', ':', ';', '!', ' ', '\\', '{', '}', '#', '_', '&', '%', '$', '|']);

const ENVIRONMENTS = new Set(['array', 'matrix', 'pmatrix', 'bmatrix', 'vmatrix', 'cases', 'aligned', 'gathered', 'split']);
const OPERATOR_NAMES = new Set(['sech', 'csch', 'arcsinh', 'arccosh', 'arctanh', 'erf', 'erfc', 'sgn', 'Li', 'Re', 'Im', 'tr']);

/** Characters outside control sequences: ASCII letters, digits, white space and math punctuation. No $ % # ~ " @ ` or non-ASCII. */
const PLAIN = /^[A-Za-z0-9 \t\n+\-*/=()[\]<>|,.;:!'^_{}&?]$/;

/** A control word is a backslash and every letter after it (TeX reads the longest run). */
const LETTERS = /[A-Za-z]+/y;

export const MAX_MATH_LENGTH = 20_000;

/** The formula without blank lines (one would end math mode), or null when any part of it is not allowed. */
export function safeMath(latex: string): string | null {
	if (latex.length > MAX_MATH_LENGTH) return null;
	const src = latex.replace(/\r/g, '').replace(/\n(?:[ \t]*\n)+/g, '\n');
	// TeX reads ^^5c as a backslash before anything else sees it; checked after the clean-up, which could join two ^
	if (src.includes('^^')) return null;
	const envs: string[] = [];
	let depth = 0;
	let delimiters = 0;
	for (let i = 0; i < src.length;) {
		const ch = src[i];
		if (ch !== '\\') {
			if (!PLAIN.test(ch)) return null;
			if (ch === '{') depth++;
			else if (ch === '}' && --depth < 0) return null;
			i++;
			continue;
		}
		LETTERS.lastIndex = i + 1;
		const word = LETTERS.exec(src)?.[0];
		if (!word) {
			if (!SYMBOLS.has(src[i + 1] ?? '')) return null;
			i += 2;
			continue;
		}
		if (!WORDS.has(word)) return null;
		i += 1 + word.length;
		if (word === 'left') delimiters++;
		else if (word === 'right' && --delimiters < 0) return null;
		else if (word === 'begin' || word === 'end' || word === 'operatorname') {
			// TeX skips spaces after a control word, then reads one braced group: read it the same way
			const arg = /^\s*\{([A-Za-z]+)\}/.exec(src.slice(i, i + 60));
			if (!arg) return null;
			const name = arg[1];
			if (word === 'operatorname' ? !OPERATOR_NAMES.has(name) : !ENVIRONMENTS.has(name)) return null;
			if (word === 'begin') envs.push(name);
			else if (word === 'end' && envs.pop() !== name) return null;
			i += arg[0].length;
		}
	}
	return depth === 0 && delimiters === 0 && envs.length === 0 ? src : null;
}
