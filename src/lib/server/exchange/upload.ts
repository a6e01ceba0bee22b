// Reading one uploaded file from a request: multipart/form-data (field "file", as a browser's
// form sends) or the raw bytes with the name in ?name=. The size limit is enforced before the
// body is buffered when the length is declared, and while reading otherwise, so an oversize
// upload is refused with 413 without being held in memory or stored.
import { ApiProblem } from '../api/respond';
import { limitText, uploadLimit } from './limits';
import { cleanFileName } from './file-type';

export interface Upload {
	fileName: string;
	bytes: Buffer;
	/** Other text fields of a multipart form. */
	fields: Record<string, string>;
}

const tooLarge = (limit: number) =>
	new ApiProblem(413, `The file is over the ${limitText(limit)} upload limit.`, {
		code: 'too_large',
		limit
	});

async function readCapped(request: Request, cap: number, limit: number): Promise<Buffer> {
	const declared = Number(request.headers.get('content-length') ?? NaN);
	if (Number.isFinite(declared) && declared > cap) throw tooLarge(limit);
	if (!request.body) return Buffer.alloc(0);
	const chunks: Buffer[] = [];
	let total = 0;
	const reader = request.body.getReader();
	for (;;) {
		const { done, value } = await reader.read();
		if (done) break;
		total += value.byteLength;
		if (total > cap) {
			await reader.cancel();
			throw tooLarge(limit);
		}
		chunks.push(Buffer.from(value));
	}
	return Buffer.concat(chunks);
}

export async function readUpload(
	request: Request,
	url: URL,
	limit = uploadLimit()
): Promise<Upload> {
	const type = request.headers.get('content-type') ?? '';
	if (type.startsWith('multipart/form-data')) {
		// The form's boundaries and other fields take a little room beyond the file itself.
		const body = await readCapped(request, limit + 64 * 1024, limit);
		let form: FormData;
		try {
			form = await new Response(new Uint8Array(body), {
				headers: { 'content-type': type }
			}).formData();
		} catch {
			throw new ApiProblem(400, 'The upload is not a readable multipart form.');
		}
		const file = form.get('file');
		if (!file || typeof file === 'string')
			throw new ApiProblem(400, 'file: choose a file to upload (form field "file").');
		if (file.size > limit) throw tooLarge(limit);
		const fields: Record<string, string> = {};
		for (const [k, v] of form.entries()) if (typeof v === 'string') fields[k] = v;
		return {
			fileName: cleanFileName(file.name),
			bytes: Buffer.from(await file.arrayBuffer()),
			fields
		};
	}
	const bytes = await readCapped(request, limit, limit);
	return {
		fileName: cleanFileName(url.searchParams.get('name') ?? ''),
		bytes,
		fields: Object.fromEntries(url.searchParams)
	};
}
