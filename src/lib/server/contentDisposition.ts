/**
 * Content-Disposition for downloads (RFC 6266 with the RFC 5987/8187 `filename*` parameter), built
 * by the well-known `content-disposition` package: any file name — en dashes, Greek, CJK, quotes,
 * CR/LF — gives a valid header with an ASCII fallback, never a 500.
 */
import contentDisposition from 'content-disposition';

/** Removes control characters and path separators; keeps everything else a person would type. */
export function cleanFilename(name: string, fallback = 'download'): string {
	// eslint-disable-next-line no-control-regex
	const cleaned = name.replace(/[\u0000-\u001f\u007f-\u009f]+/g, ' ').replace(/[\\/]+/g, '-').replace(/\s+/g, ' ').trim();
	return cleaned.slice(0, 200) || fallback;
}

/** `attachment; filename="ascii"; filename*=UTF-8''percent-encoded`. */
export function attachment(filename: string): string {
	const clean = cleanFilename(filename);
	// ASCII fallback: non-ASCII letters become '_' (quotes and backslashes are escaped by the package).
	const ascii = clean.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').replace(/[^\x20-\x7e]/g, '_');
	return contentDisposition(clean, { type: 'attachment', fallback: ascii });
}
