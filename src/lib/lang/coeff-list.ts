/**
 * `coeffs` written for a paper: the expansion on its own line, then one coefficient per line in an `aligned`
 * block, then every symbol the coefficients use, defined — in LaTeX (to paste into a paper) and in plain text
 * (to paste into a mail or a referee report). The one-line `latex` of the series result stays as it was.
 */
import type { BulkState } from './result';
import type { SeriesTerms } from './verbs/index';
import { shortNumber, texNumber } from './format';

/** One symbol the list uses, defined in LaTeX and in plain text. */
export interface SymbolDef {
	tex: string;
	text: string;
}

export interface CoefficientList {
	/** `\begin{aligned} … \end{aligned}`: the expansion, a_1 … a_n one per line, then the definitions */
	latex: string;
	/** the same in plain text, coefficients as full-precision numbers */
	text: string;
	defs: SymbolDef[];
}

/** Whether every term is a power k·d of ℓ/scale, so τ = (ℓ/scale)^d makes the sum a plain power series. */
function powersOfTau(st: SeriesTerms): boolean {
	return st.scale !== '1' && st.terms.every((t) => t.power === t.k * st.d);
}

const scaleText = (s: SeriesTerms['scale']) => (s === 'z_p' ? 'z_p' : 'z_h');

/** The symbols the coefficients and the expansion use, for this bulk; only those that appear are listed. */
export function symbolDefs(st: SeriesTerms, bulk: BulkState): SymbolDef[] {
	const defs: SymbolDef[] = [];
	const tex = st.terms.map((t) => t.latex).join(' ');
	const d = st.d;
	defs.push({
		tex: `\\Delta A = A - A_{\\mathrm{vac}}\\ \\text{(finite, per unit transverse volume)}`,
		text: 'ΔA = A − A_vac: the strip’s area minus the vacuum’s (finite), per unit transverse volume'
	});
	defs.push({ tex: `\\ell\\ \\text{: the strip width}`, text: 'ℓ: the strip’s width' });
	defs.push({
		tex: `d = ${d}\\ \\text{: boundary spacetime dimension}`,
		text: `d = ${d}: the boundary spacetime dimension (bulk AdS_${d + 1})`
	});
	if (st.scale === 'z_h') defs.push({ tex: 'z_h\\ \\text{: horizon depth}', text: 'z_h: the horizon depth (brane T = d/(4π z_h))' });
	if (st.scale === 'z_p')
		defs.push({
			tex: 'z_p\\ \\text{: wave scale, } g_{yy} = z^{-2}(1 + (z/z_p)^{d})',
			text: 'z_p: the wave’s scale, g_yy = (1/z²)(1 + (z/z_p)^d)'
		});
	if (powersOfTau(st)) {
		const s = scaleText(st.scale);
		defs.push({ tex: `\\tau = (\\ell/${s})^{${d}}`, text: `τ = (ℓ/${s})^${d}` });
	}
	if (/\\kappa/.test(tex)) {
		const v = Number(bulk.params.v);
		const kappa = Number.isFinite(v) && Math.abs(v) < 1 ? (v * v) / (1 - v * v) : NaN;
		const at = Number.isFinite(kappa) ? ` = ${texNumber(kappa, 10)}` : '';
		defs.push({
			tex: `\\kappa = \\gamma^{2}v^{2} = \\frac{v^{2}}{1-v^{2}}${Number.isFinite(kappa) ? `${at}\\ (v = ${texNumber(v)})` : ''}`,
			text: `κ = γ²v² = v²/(1 − v²)${Number.isFinite(kappa) ? ` = ${shortNumber(kappa)} (v = ${shortNumber(v)})` : ''}, γ = 1/√(1 − v²): the boost`
		});
	}
	if (/\\mathrm\{B\}/.test(tex))
		defs.push({
			tex: `\\mathrm{B}(x,y) = \\frac{\\Gamma(x)\\Gamma(y)}{\\Gamma(x+y)}\\ \\text{: Euler Beta function}`,
			text: 'B(x, y) = Γ(x)Γ(y)/Γ(x + y): Euler’s Beta function'
		});
	if (bulk.name === 'charged' && /q/.test(tex)) {
		const q = Number(bulk.params.q);
		defs.push({
			tex: `q${Number.isFinite(q) ? ` = ${texNumber(q)}` : ''}:\\ f = 1 - (1+q^{2})(z/z_h)^{${d}} + q^{2}(z/z_h)^{${2 * (d - 1)}}`,
			text: `q${Number.isFinite(q) ? ` = ${shortNumber(q)}` : ''}: the charge, f = 1 − (1+q²)(z/z_h)^${d} + q²(z/z_h)^${2 * (d - 1)}`
		});
	}
	if (bulk.name === 'metric') {
		const fns = (['f', 'g', 'h'] as const)
			.filter((k) => typeof bulk.params[k] === 'string')
			.map((k) => [k, String(bulk.params[k])] as const);
		if (fns.length)
			defs.push({
				tex: `\\text{parameters of }${fns.map(([k, f]) => `${k}(z) = ${formulaTex(f)}`).join(',\\ ')}`,
				text: `the named parameters are those of ${fns.map(([k, f]) => `${k}(z) = ${f}`).join(', ')}; coefficients are decimal numbers times their monomials`
			});
	}
	return defs;
}

/** A metric's formula as math: `*` a thin space, anything but plain math characters left out (the .tex export's allow-list). */
function formulaTex(f: string): string {
	return f
		.replace(/\*\*/g, '^')
		.replace(/\*/g, '\\,')
		.replace(/[^A-Za-z0-9 +\-/=().^,\\]/g, '');
}

/** The expansion the coefficients belong to, as LaTeX and as text. */
function expansion(st: SeriesTerms): { tex: string; text: string } {
	const d = st.d;
	const pre = d === 2 ? '' : `\\ell^{${2 - d}}`;
	const preText = d === 2 ? '' : `ℓ^(${2 - d}) `;
	if (powersOfTau(st)) return { tex: `\\Delta A &= ${pre}\\sum_{k\\ge1} a_{k}\\,\\tau^{k}`, text: `ΔA = ${preText}Σ_k a_k τ^k` };
	if (st.scale === '1') return { tex: `\\Delta A &= ${pre}\\sum_{k\\ge1} a_{k}\\,\\ell^{p_k}`, text: `ΔA = ${preText}Σ_k a_k ℓ^(p_k)` };
	const s = scaleText(st.scale);
	return { tex: `\\Delta A &= ${pre}\\sum_{k\\ge1} a_{k}\\,(\\ell/${s})^{p_k}`, text: `ΔA = ${preText}Σ_k a_k (ℓ/${s})^(p_k)` };
}

/** The coefficients as an aligned list, one per line, with every symbol they use defined. */
export function coefficientList(st: SeriesTerms, bulk: BulkState): CoefficientList {
	const defs = symbolDefs(st, bulk);
	const ex = expansion(st);
	const tau = powersOfTau(st);
	const lines = [ex.tex];
	const text = [ex.text];
	for (const t of st.terms) {
		// non-τ expansions name each term's power beside it (the charged brane's mixed powers, a metric's ℓ^K)
		const p = tau ? '' : `\\quad (p_{${t.k}} = ${t.power})`;
		const value = Number.isFinite(t.coeff) ? ` \\approx ${texNumber(t.coeff, 12)}` : '';
		lines.push(`a_{${t.k}} &= ${t.latex || texNumber(t.coeff, 12)}${t.latex && value ? value : ''}${p}`);
		const num = Number.isFinite(t.coeff) ? String(t.coeff) : 'exact form only (see the LaTeX)';
		text.push(`a_${t.k} = ${num}${tau ? '' : `   (p_${t.k} = ${t.power})`}`);
	}
	// one block (amsmath's aligned; KaTeX draws it too): the definitions are its last lines, one symbol each
	lines.push('&\\text{where}', ...defs.map((d) => `&\\quad ${d.tex}`));
	const latex = `\\begin{aligned}\n${lines.join(' \\\\\n')}\n\\end{aligned}`;
	return { latex, text: [...text, 'where', ...defs.map((d) => `  ${d.text}`)].join('\n') + '\n', defs };
}
