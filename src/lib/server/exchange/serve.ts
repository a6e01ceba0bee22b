// How stored files leave the server: a type we decided from the bytes, never HTML; downloads by
// default; images may be shown inline, but only with nosniff and a sandboxing CSP, so even a
// crafted image cannot run script in our origin. PDFs are always downloaded (viewers can run
// their own scripts).
import { isImage } from './file-type';

/** RFC 6266 / RFC 5987: an ASCII fallback name plus the exact UTF-8 name. */
export function contentDisposition(kind: 'attachment' | 'inline', fileName: string): string {
	const fallback = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
	return `${kind}; filename="${fallback}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

export function fileResponse(
	body: Buffer | string,
	contentType: string,
	fileName: string,
	{ inline = false } = {}
): Response {
	const showInline = inline && isImage(contentType);
	return new Response(typeof body === 'string' ? body : new Uint8Array(body), {
		status: 200,
		headers: {
			'content-type': contentType,
			'content-length': String(Buffer.byteLength(body)),
			'content-disposition': contentDisposition(showInline ? 'inline' : 'attachment', fileName),
			'x-content-type-options': 'nosniff',
			'content-security-policy': "default-src 'none'; img-src 'self'; sandbox",
			'cross-origin-resource-policy': 'same-origin',
			'cache-control': 'private, no-store'
		}
	});
}
