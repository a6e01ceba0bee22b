// POST /api/analyze with variants: the base by default, one variant by name, all of them in one
// request, and a variant the solver refuses keeping its own error while the others analyse.
import { afterAll, describe, expect, it } from 'vitest';
import type { RequestEvent } from '@sveltejs/kit';
import { POST } from '../../src/routes/api/analyze/+server';
import { closeAnalysisPool } from '../../src/lib/server/jobs/analysis-pool';
import type { NetworkDocument } from '../../src/lib/network/schema';
import type { VariantSet } from '../../src/lib/network/variant-schema';

afterAll(closeAnalysisPool);

const someone = { id: '00000000-0000-4000-8000-000000000001', email: 'a@example.test', name: 'A' };

function call(body: object, query = '') {
	const url = new URL(`http://127.0.0.1/api/analyze${query}`);
	const request = new Request(url, {
		method: 'POST',
		headers: { 'content-type': 'application/json' },
		body: JSON.stringify(body)
	});
	const event = {
		request,
		url,
		params: {},
		locals: { user: someone, session: null, auth: 'token' }
	};
	return POST(event as unknown as RequestEvent);
}

// RC low-pass whose R is 1k, 2k or 4k by "Range" and whose load is in or out by "Load".
const doc = {
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '1k' },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '1n' },
		{ id: 'RL', type: 'R', nodes: ['out', 'gnd'], value: '1k' }
	],
	input: 'V1',
	output: { node: 'out' },
	variants: {
		absent: ['RL'],
		groups: [
			{
				name: 'Range',
				options: [
					{ name: 'x1' },
					{ name: 'x2', values: { R1: '2k' } },
					{ name: 'x4', values: { R1: '4k' } }
				]
			},
			{ name: 'Load', options: [{ name: 'open' }, { name: 'loaded', present: ['RL'] }] }
		]
	}
} as NetworkDocument & { variants: VariantSet };
const pole = (a: { poles: { re: number }[] }) => -a.poles[0].re;
const rel = (a: number, b: number) => Math.abs(a - b) / b;

describe('POST /api/analyze with variants', () => {
	it('without a variant asked for: the base network (RL absent), as before', async () => {
		const r = await call(doc, '?points=20');
		expect(r.status).toBe(200);
		// Closed form: one pole at 1/(R1·C1) = 1e6 rad/s; DC gain 1.
		const a = await r.json();
		expect(rel(pole(a), 1e6)).toBeLessThan(1e-9);
		expect(a.dcGain).toBeCloseTo(1, 12);
	});

	it('one variant by name', async () => {
		const r = await call(doc, `?variant=${encodeURIComponent('x2 · loaded')}`);
		expect(r.status).toBe(200);
		const a = await r.json();
		// Closed form: R1 ∥ RL = 2k ∥ 1k = 666.7 Ω drives C1; DC gain RL/(R1+RL) = 1/3.
		expect(rel(pole(a), 1 / ((2000 / 3) * 1e-9))).toBeLessThan(1e-9);
		expect(a.dcGain).toBeCloseTo(1 / 3, 12);
	});

	it('all variants in one request, each with its own analysis', async () => {
		const r = await call(doc, '?variants=all&points=20&omit=expansion');
		expect(r.status).toBe(200);
		const { variants } = await r.json();
		expect(variants.map((v: { name: string }) => v.name)).toEqual([
			'x1 · open',
			'x1 · loaded',
			'x2 · open',
			'x2 · loaded',
			'x4 · open',
			'x4 · loaded'
		]);
		for (const [i, v] of variants.entries()) {
			const r1 = [1e3, 2e3, 4e3][Math.floor(i / 2)];
			const loaded = i % 2 === 1;
			const rEff = loaded ? (r1 * 1e3) / (r1 + 1e3) : r1;
			expect(v.error).toBeNull();
			expect(v.options).toHaveLength(2);
			expect(rel(pole(v.analysis), 1 / (rEff * 1e-9))).toBeLessThan(1e-9);
			expect(v.analysis.expansion).toBeNull();
			expect(v.analysis.frequencyResponse.f).toHaveLength(20);
		}
	});

	it('a variant the solver refuses has its error; the others still analyse', async () => {
		const broken = structuredClone(doc);
		broken.variants.groups[1].options[1].absent = ['C1'];
		broken.variants.groups[1].options[1].name = 'no cap';
		broken.variants.groups[0].options[0] = { name: 'x1', absent: ['V1'] };
		const { variants } = await (await call(broken, '?variants=all')).json();
		const first = variants[0];
		expect(first.analysis).toBeNull();
		expect(first.error.code).toBe('bad_input');
		expect(variants[2].error).toBeNull();
		const one = await call(broken, `?variant=${encodeURIComponent('x1 · open')}`);
		expect(one.status).toBe(422);
		const body = await one.json();
		expect(body.error).toMatch(/^variant "x1 · open": input "V1" is not an element/);
		expect(body.variant).toBe('x1 · open');
	});

	it('an unknown variant is 422 naming the real ones; variants=all without variants is 400', async () => {
		const r = await call(doc, '?variant=x3');
		expect(r.status).toBe(422);
		expect((await r.json()).error).toMatch(/no variant "x3"; the sheet has "x1 · open"/);
		const plain = { ...doc, variants: undefined };
		const r2 = await call(plain, '?variants=all');
		expect(r2.status).toBe(400);
		expect((await r2.json()).code).toBe('no_variants');
		expect((await call(doc, '?variants=some')).status).toBe(400);
	});

	it('a broken variant block is refused up front with the option and element named', async () => {
		const bad = structuredClone(doc);
		bad.variants.groups[0].options[1].values = { R9: '1k' };
		const r = await call(bad, '?variants=all');
		expect(r.status).toBe(422);
		const body = await r.json();
		expect(body).toMatchObject({ code: 'bad_variants', element: 'R9' });
		expect(body.error).toBe('variant option "Range: x2": there is no element "R9" on the sheet');
	});
});
