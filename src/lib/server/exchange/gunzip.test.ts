import { gzipSync } from 'node:zlib';
import { describe, expect, test } from 'vitest';
import { gunzipCapped, isGzip } from './gunzip';
import { parseSheetFile } from './transfer-actions';

describe('compressed sheet files', () => {
	const ladder = (n: number) => ({
		schema: 1,
		title: 'Trace model',
		elements: [
			{ id: 'Vin', type: 'V', nodes: ['x0', 'gnd'], value: 1 },
			...Array.from({ length: n }, (_, i) => [
				{ id: `R${i + 1}`, type: 'R', nodes: [`x${i}`, `x${i + 1}`], value: 1000 },
				{ id: `C${i + 1}`, type: 'C', nodes: [`x${i + 1}`, 'gnd'], value: 1e-9 }
			]).flat()
		],
		input: 'Vin',
		output: { node: `x${n}` }
	});

	test('a .json.gz network document over the plain 2 MB limit imports (20,000 sections)', async () => {
		const text = JSON.stringify(ladder(20000));
		expect(text.length).toBeGreaterThan(2_000_000);
		const bytes = gzipSync(text);
		expect(isGzip(bytes)).toBe(true);
		const content = await parseSheetFile(bytes, 'trace.json.gz');
		expect(content.name).toBe('Trace model');
		expect((content.document as { elements: unknown[] }).elements).toHaveLength(40001);
	});

	test('inflation stops at the cap: 413 naming the limit, nothing more is held', async () => {
		const bomb = gzipSync(Buffer.alloc(50_000_000, 32));
		expect(bomb.length).toBeLessThan(100_000);
		await expect(gunzipCapped(bomb, 1_000_000)).rejects.toMatchObject({
			status: 413,
			message: 'The file inflates to more than 1 MB.'
		});
	});

	test('bytes that start like gzip but do not inflate: 400', async () => {
		await expect(gunzipCapped(Buffer.from([0x1f, 0x8b, 1, 2, 3]), 1000)).rejects.toMatchObject({
			status: 400
		});
	});

	test('plain JSON still imports as before', async () => {
		const content = await parseSheetFile(Buffer.from(JSON.stringify(ladder(3))), 'small.json');
		expect((content.document as { elements: unknown[] }).elements).toHaveLength(7);
	});
});
