/**
 * Print resolution for PNG: the figure is drawn at PRINT_SCALE × its screen size (640 → 2000 px across) and
 * the file says 300 dpi in a pHYs chunk, so \includegraphics sizes it at 6.67 in, a full text width, at print
 * resolution. Canvas PNGs carry no pHYs, so it is inserted after IHDR.
 */
export const PRINT_DPI = 300;
/** 640 px × 3.125 = 2000 px: 300 dpi at 6.67 in, a full text width */
export const PRINT_SCALE = 3.125;

let table: Uint32Array | null = null;
function crc32(bytes: Uint8Array): number {
	if (!table) {
		table = new Uint32Array(256);
		for (let n = 0; n < 256; n++) {
			let c = n;
			for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
			table[n] = c >>> 0;
		}
	}
	let c = 0xffffffff;
	for (const b of bytes) c = table[(c ^ b) & 0xff]! ^ (c >>> 8);
	return (c ^ 0xffffffff) >>> 0;
}

/** The PNG with a pHYs chunk of `dpi` right after IHDR (a canvas PNG has none). */
export function withDpi(png: Uint8Array, dpi = PRINT_DPI): Uint8Array<ArrayBuffer> {
	const ihdrEnd = 8 + 4 + 4 + 13 + 4; // signature, IHDR length, type, data, crc
	const ppm = Math.round(dpi / 0.0254);
	const chunk = new Uint8Array(21);
	const v = new DataView(chunk.buffer);
	v.setUint32(0, 9);
	chunk.set([0x70, 0x48, 0x59, 0x73], 4); // "pHYs"
	v.setUint32(8, ppm);
	v.setUint32(12, ppm);
	chunk[16] = 1; // unit: metre
	v.setUint32(17, crc32(chunk.subarray(4, 17)));
	const out = new Uint8Array(png.length + chunk.length);
	out.set(png.subarray(0, ihdrEnd), 0);
	out.set(chunk, ihdrEnd);
	out.set(png.subarray(ihdrEnd), ihdrEnd + chunk.length);
	return out;
}

/** Reads the pHYs dpi back (x axis), or null: for tests and for checking a saved file. */
export function readDpi(png: Uint8Array): number | null {
	const v = new DataView(png.buffer, png.byteOffset, png.byteLength);
	for (let i = 8; i + 8 <= png.length;) {
		const len = v.getUint32(i);
		const type = String.fromCharCode(...png.subarray(i + 4, i + 8));
		if (type === 'pHYs' && png[i + 16] === 1) return Math.round(v.getUint32(i + 8) * 0.0254);
		i += 12 + len;
	}
	return null;
}
