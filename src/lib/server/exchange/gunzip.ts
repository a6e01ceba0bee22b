// Compressed sheet files (.json.gz): a 100,000-element network is about 7 MB of JSON but well
// under a megabyte compressed, so large imports fit the ordinary upload limit. The bytes are
// inflated as a stream and the inflation stops the moment the output passes the cap, so a
// small file that inflates to gigabytes (a "zip bomb") costs nothing beyond the cap.
import { createGunzip } from 'node:zlib';
import { ApiProblem } from '../api/respond';

export const isGzip = (bytes: Buffer) => bytes.length > 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;

export function gunzipCapped(bytes: Buffer, cap: number): Promise<Buffer> {
	return new Promise((resolve, reject) => {
		const z = createGunzip();
		const chunks: Buffer[] = [];
		let total = 0;
		z.on('data', (chunk: Buffer) => {
			total += chunk.length;
			if (total > cap) {
				z.destroy();
				reject(
					new ApiProblem(413, `The file inflates to more than ${cap / 1_000_000} MB.`, {
						code: 'too_large',
						limit: cap
					})
				);
				return;
			}
			chunks.push(chunk);
		});
		z.on('end', () => resolve(Buffer.concat(chunks)));
		z.on('error', () =>
			reject(new ApiProblem(400, 'The file looks compressed (gzip) but does not inflate.'))
		);
		z.end(bytes);
	});
}
