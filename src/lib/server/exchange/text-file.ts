// An uploaded CSV as text. Instruments write UTF-8 or Latin-1 (a "°" in a header); a file with
// NUL bytes or the signature of an image/PDF is not a CSV whatever its name says.
import { ApiProblem } from '../api/respond';
import { sniffType } from './file-type';

export function uploadedText(bytes: Buffer, what = 'a CSV text file'): string {
	const sniffed = sniffType(bytes);
	if (sniffed || bytes.subarray(0, 8192).includes(0)) {
		throw new ApiProblem(
			415,
			`The file is not ${what}${sniffed ? ` (its content is ${sniffed})` : ' (it holds binary data)'}.`,
			{ code: 'unsupported_type' }
		);
	}
	try {
		return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
	} catch {
		return new TextDecoder('latin1').decode(bytes);
	}
}
