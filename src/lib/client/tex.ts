/**
 * KaTeX rendering for result formulas. The LaTeX comes from the engine, but a macro body or a shared pad may
 * carry text someone else typed, so it is rendered as untrusted input: no \href/\url/\includegraphics
 * (trust: false), a small macro-expansion budget against expansion bombs, capped sizes, and never a throw.
 *
 * KaTeX is about half of what a pad page would otherwise ship, so the browser loads it on first need; the
 * server registers its own copy (see `useKatex`) so the first paint already has typeset formulas.
 */
type Katex = typeof import('katex').default;

export const KATEX_OPTIONS = {
	trust: false,
	maxExpand: 50,
	maxSize: 10,
	strict: 'ignore',
	throwOnError: false,
	output: 'html'
} as const;

let katex: Katex | null = null;
let loading: Promise<Katex> | null = null;
const listeners = new Set<() => void>();
const cache = new Map<string, string>();

/** Registers an already-imported KaTeX (the server does this so SSR is synchronous). */
export function useKatex(k: Katex) {
	katex = k;
}

export function katexReady(): boolean {
	return katex !== null;
}

/** Loads KaTeX in the browser once; resolves immediately when it is there. */
export function loadKatex(): Promise<Katex> {
	if (katex) return Promise.resolve(katex);
	loading ??= import('katex').then((m) => {
		katex = m.default;
		for (const f of listeners) f();
		listeners.clear();
		return katex;
	});
	return loading;
}

export function onKatexReady(f: () => void) {
	if (katex) f();
	else listeners.add(f);
	return () => listeners.delete(f);
}

function escapeHtml(s: string) {
	return s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/**
 * HTML for `src`, or — before KaTeX is loaded — the escaped source in a code span (never empty, so a
 * hydrating page keeps the server's typeset nodes until the same HTML can be made here).
 */
export function renderTex(src: string, display = false): string {
	const key = (display ? 'D' : 'I') + src;
	const hit = cache.get(key);
	if (hit) return hit;
	if (!katex) return `<code class="tex-src">${escapeHtml(src)}</code>`;
	let html: string;
	try {
		html = katex.renderToString(src, { ...KATEX_OPTIONS, displayMode: display });
	} catch {
		html = `<code class="tex-src">${escapeHtml(src)}</code>`;
	}
	if (cache.size > 500) cache.clear();
	cache.set(key, html);
	return html;
}
