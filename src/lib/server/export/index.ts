import { z } from 'zod';
import { renderLatex } from './latex';
import { renderMarkdown } from './markdown';
import { toPadDocument, type PadSource } from './schema';

export const exportFormatSchema = z.enum(['md', 'tex', 'json'], { error: 'format must be md, tex or json' });
export type ExportFormat = z.infer<typeof exportFormatSchema>;

const TYPES: Record<ExportFormat, string> = {
	md: 'text/markdown; charset=utf-8',
	tex: 'application/x-tex; charset=utf-8',
	json: 'application/json; charset=utf-8'
};

/** A file name from the title: lower-case ASCII words joined by dashes, never empty. */
export function exportFilename(title: string, format: ExportFormat): string {
	const base = title
		.normalize('NFKD')
		.replace(/[^\x20-\x7e]/g, '')
		.toLowerCase()
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-+|-+$/g, '')
		.slice(0, 60);
	return `${base || 'pad'}.${format}`;
}

/** The whole pad in one format, ready to answer as a download. */
export function exportPad(src: PadSource, format: ExportFormat, meta: { owner?: string; exportedAt?: Date } = {}) {
	const doc = toPadDocument(src);
	const body =
		format === 'md' ? renderMarkdown(doc, meta) : format === 'tex' ? renderLatex(doc, meta) : JSON.stringify(doc, null, 2) + '\n';
	return { body, contentType: TYPES[format], filename: exportFilename(src.title, format) };
}

/** The download response: content-disposition names the file, and the body is never sniffed as HTML. */
export function downloadResponse(file: ReturnType<typeof exportPad>): Response {
	return new Response(file.body, {
		headers: {
			'content-type': file.contentType,
			'content-disposition': `attachment; filename="${file.filename}"`,
			'cache-control': 'no-store'
		}
	});
}
