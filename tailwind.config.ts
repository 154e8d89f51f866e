import type { Config } from 'tailwindcss';

/**
 * Bulkpad's own palette: warm paper and deep ink for reading formulas all day, a horizon amber for the
 * prompt and focus, a bulk teal for geometry, and a drift vermilion for anything that no longer reproduces.
 */
export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	darkMode: 'class',
	theme: {
		extend: {
			colors: {
				paper: { DEFAULT: '#f5f1e8', deep: '#ebe5d6', edge: '#d8d0bd' },
				// faint, drift and steady are dark enough for 4.5:1 on paper and paper-deep (WCAG AA; checked by axe in tests/e2e)
				ink: { DEFAULT: '#1c2230', soft: '#4a5266', faint: '#5f6678' },
				night: { DEFAULT: '#121715', deep: '#0b0f0e', edge: '#26302d', text: '#dbe4df', soft: '#9aa8a2' },
				horizon: { DEFAULT: '#c9731f', light: '#f0b46a', dark: '#94500f' },
				bulk: { DEFAULT: '#1e7470', light: '#5fb3ad', dark: '#134d4a' },
				drift: { DEFAULT: '#9a3011', light: '#f08a6c' },
				steady: { DEFAULT: '#2f632c', light: '#8cc487' }
			},
			fontFamily: {
				mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace']
			}
		}
	}
} satisfies Config;
