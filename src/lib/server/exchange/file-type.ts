// The type of an uploaded file from its first bytes (magic numbers), never from its name or the
// Content-Type the browser sent: a script renamed to .png is refused. Only formats we can show
// or hand back safely are allowed; malware scanning is out of scope (docs/exchange.md).
export const ALLOWED_TYPES = [
	'image/png',
	'image/jpeg',
	'image/gif',
	'image/webp',
	'application/pdf'
] as const;
export type AllowedType = (typeof ALLOWED_TYPES)[number];

const EXTENSIONS: Record<AllowedType, string[]> = {
	'image/png': ['png'],
	'image/jpeg': ['jpg', 'jpeg'],
	'image/gif': ['gif'],
	'image/webp': ['webp'],
	'application/pdf': ['pdf']
};

const starts = (b: Uint8Array, sig: number[], at = 0) =>
	b.length >= at + sig.length && sig.every((x, i) => b[at + i] === x);
const ascii = (s: string) => [...s].map((c) => c.charCodeAt(0));

/** The file's real type, or null when it is none of the allowed ones. */
export function sniffType(bytes: Uint8Array): AllowedType | null {
	if (starts(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
	if (starts(bytes, [0xff, 0xd8, 0xff])) return 'image/jpeg';
	if (starts(bytes, ascii('GIF87a')) || starts(bytes, ascii('GIF89a'))) return 'image/gif';
	if (starts(bytes, ascii('RIFF')) && starts(bytes, ascii('WEBP'), 8)) return 'image/webp';
	// PDF readers accept the header within the first 1024 bytes; we ask for it at the start,
	// which every PDF writer does and which leaves no room for a polyglot prefix.
	if (starts(bytes, ascii('%PDF-'))) return 'application/pdf';
	return null;
}

export function isImage(type: string): boolean {
	return type.startsWith('image/');
}

/** The name's extension matches the sniffed type (a PDF named .png is refused as disguised). */
export function extensionFits(fileName: string, type: AllowedType): boolean {
	const ext = /\.([a-z0-9]+)$/i.exec(fileName)?.[1]?.toLowerCase();
	return ext === undefined || EXTENSIONS[type].includes(ext);
}

/** A file name safe to store and to put in Content-Disposition: no paths, no control characters. */
export function cleanFileName(name: string, fallback = 'file'): string {
	const base = name.split(/[\\/]/).pop() ?? '';
	// Control characters are exactly what must go.
	// eslint-disable-next-line no-control-regex
	const unsafe = /[\u0000-\u001f\u007f"<>|:*?]/g;
	const clean = base.replace(unsafe, '').trim().slice(0, 200);
	return clean && clean !== '.' && clean !== '..' ? clean : fallback;
}
