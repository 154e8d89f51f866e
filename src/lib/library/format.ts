/** Sizes as the upload form and the API's messages show them (decimal units, like file managers). */
export function formatBytes(n: number): string {
	if (n < 1000) return `${n} B`;
	if (n < 1_000_000) return `${(n / 1000).toFixed(n < 10_000 ? 1 : 0)} kB`;
	return `${(n / 1_000_000).toFixed(2)} MB`;
}
