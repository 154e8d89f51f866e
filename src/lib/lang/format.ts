/**
 * Labels and KaTeX-compatible LaTeX for results. Numbers are shown to 10 significant digits in LaTeX
 * (the value field keeps full precision); exponents become ×10^{n} because KaTeX has no "e" notation.
 */
import type { Order } from './result';
import type { BulkState } from './result';
import { sigFigs } from '../holo/numeric/digits';

/** A number as LaTeX: 1.234567890\times10^{-3}. */
export function texNumber(x: number, digits = 10): string {
	if (!Number.isFinite(x)) return x > 0 ? '\\infty' : x < 0 ? '-\\infty' : '\\mathrm{NaN}';
	if (x === 0) return '0';
	const s = Number(x.toPrecision(digits)).toString();
	const m = /^(-?[\d.]+)e([+-]\d+)$/.exec(s);
	if (!m) return s;
	const exp = Number(m[2]);
	return `${m[1]}\\times10^{${exp}}`;
}

/** A number for a label: short, 6 significant digits (the engine's formatter, so messages and labels agree). */
export function shortNumber(x: number): string {
	return sigFigs(x, 6);
}

/** `boosted d=4 zh=1 v=0.6` */
export function describeBulk(b: BulkState): string {
	const kv = Object.entries(b.params).map(([k, v]) => (typeof v === 'string' ? `${k}="${v}"` : `${k}=${shortNumber(v)}`));
	return [b.name, ...kv].join(' ');
}

export function orderName(o: Order): string {
	return o === 'exact' ? 'exact' : `o${o}`;
}
export function orderWords(o: Order): string {
	return o === 'exact' ? 'exact' : `order ${o}`;
}

/** Per verb: a plain-text symbol for labels and a LaTeX symbol. */
export const SYMBOLS: Record<string, { text: string; tex: string }> = {
	zstar: { text: 'z*', tex: 'z_*' },
	width: { text: 'l', tex: '\\ell' },
	area: { text: 'A_fin', tex: 'A_{\\mathrm{fin}}' },
	darea: { text: 'ΔA', tex: '\\Delta A' },
	// the finite part: the area-law term is subtracted (holo/units.ts, finitePartNote)
	entropy: { text: 'S_fin', tex: 'S_{\\mathrm{fin}}' },
	dentropy: { text: 'ΔS', tex: '\\Delta S' },
	energy: { text: 'ΔE', tex: '\\Delta E' },
	tent: { text: 'T_ent', tex: 'T_{\\mathrm{ent}}' },
	mu: { text: 'μ', tex: '\\mu' },
	firstlaw: { text: 'first law', tex: '\\delta\\Delta S' },
	stress: { text: '⟨T_μν⟩', tex: '\\langle T_{\\mu\\nu}\\rangle' },
	thermo: { text: 'thermodynamics', tex: '' },
	coeffs: { text: 'ΔA series', tex: '\\Delta A' },
	validity: { text: 'validity', tex: '' },
	mi: { text: 'I', tex: 'I' },
	resum: { text: 'ΔA (Padé)', tex: '\\Delta A_{\\mathrm{Pad\\acute e}}' },
	phases: { text: 'soliton phases', tex: '' }
};

/** LaTeX of a key name. */
export function texKey(key: string): string {
	switch (key) {
		case 'l':
			return '\\ell';
		case 'zstar':
			return 'z_*';
		case 'zh':
			return 'z_h';
		case 'zp':
			return 'z_p';
		case 'z0':
			return 'z_0';
		case 'gap':
			return 's';
		case 'rapidity':
			return '\\eta';
		case 'o':
			return 'n';
		default:
			return key.length === 1 ? key : `\\mathrm{${key.replace(/_/g, '\\_')}}`;
	}
}

/** LaTeX of a field name of a record (tt → T_{tt}, gap_crit → s_c/\ell …). */
export function texField(field: string): string {
	const t: Record<string, string> = {
		tt: 'T_{tt}',
		ty: 'T_{ty}',
		xx: 'T_{xx}',
		yy: 'T_{yy}',
		T: 'T',
		s: 's',
		e: '\\varepsilon',
		p: 'p',
		py: 'p_y',
		E: '\\Delta E',
		P: '\\Delta P_y',
		I: 'I',
		gap_crit: 's_c/\\ell',
		l_max: '\\ell_{\\max}',
		radius: '\\ell_{\\mathrm{conv}}',
		radius_err: '\\delta\\ell_{\\mathrm{conv}}',
		l_c: '\\ell_c',
		zstar_c: 'z_*(\\ell_c)',
		zstar_max: 'z_*(\\ell_{\\max})',
		dA_dl_jump: '[\\partial_\\ell A]_{\\ell_c}',
		mu: '\\mu',
		rho: '\\rho',
		Q: '\\Delta Q',
		error: '\\delta',
		exact: '\\mathrm{exact}'
	};
	return t[field] ?? texKey(field);
}

/** `\Delta A^{(3)}(\ell=0.4) = 1.23\times10^{-2}` */
export function texScalar(verb: string, args: Record<string, number>, order: Order, value: number): string {
	const sym = SYMBOLS[verb]?.tex || verb;
	const sup = order === 'exact' ? '' : `^{(${order})}`;
	const a = Object.entries(args)
		.map(([k, v]) => `${texKey(k)}=${texNumber(v, 6)}`)
		.join(',\\ ');
	return `${sym}${sup}${a ? `\\big|_{${a}}` : ''} = ${texNumber(value)}`;
}

/** `T_{tt} = …,\quad T_{ty} = …` */
export function texRecord(fields: Record<string, number>): string {
	return Object.entries(fields)
		.map(([k, v]) => `${texField(k)} = ${texNumber(v)}`)
		.join(',\\quad ');
}
