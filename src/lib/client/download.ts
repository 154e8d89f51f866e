/** Browser-only: save text or a blob under a file name, and copy to the clipboard with a fallback. */
export function saveBlob(blob: Blob, name: string) {
	const url = URL.createObjectURL(blob);
	const a = document.createElement('a');
	a.href = url;
	a.download = name;
	document.body.append(a);
	a.click();
	a.remove();
	setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function saveText(text: string, name: string, type = 'text/plain') {
	saveBlob(new Blob([text], { type: `${type};charset=utf-8` }), name);
}

/** navigator.clipboard needs a secure context; plain http on a LAN is not one, so fall back to a textarea. */
export async function copyText(text: string): Promise<boolean> {
	try {
		await navigator.clipboard.writeText(text);
		return true;
	} catch {
		const t = document.createElement('textarea');
		t.value = text;
		t.style.position = 'fixed';
		t.style.opacity = '0';
		document.body.append(t);
		t.select();
		const ok = document.execCommand('copy');
		t.remove();
		return ok;
	}
}

/** A file-name-safe slug of a label. */
export function fileSlug(s: string): string {
	return (
		s
			.toLowerCase()
			.replace(/[^a-z0-9]+/g, '-')
			.replace(/^-|-$/g, '')
			.slice(0, 40) || 'bulkpad'
	);
}

/**
 * Rasterises an SVG element to PNG through a canvas at `scale`× for print resolution. The SVG must carry
 * its colours as attributes (PlotView does) since page CSS does not reach an <img>.
 */
export function svgToPng(svgText: string, width: number, height: number, scale = 2): Promise<Blob> {
	return new Promise((resolve, reject) => {
		const img = new Image();
		const url = URL.createObjectURL(new Blob([svgText], { type: 'image/svg+xml;charset=utf-8' }));
		img.onload = () => {
			const c = document.createElement('canvas');
			c.width = width * scale;
			c.height = height * scale;
			const g = c.getContext('2d');
			if (!g) return reject(new Error('no canvas'));
			g.fillStyle = '#ffffff';
			g.fillRect(0, 0, c.width, c.height);
			g.drawImage(img, 0, 0, c.width, c.height);
			URL.revokeObjectURL(url);
			c.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG encoding failed'))), 'image/png');
		};
		img.onerror = () => reject(new Error('the SVG could not be drawn'));
		img.src = url;
	});
}
