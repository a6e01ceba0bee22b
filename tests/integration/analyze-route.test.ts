// POST /api/analyze through its SvelteKit handler, with the real worker pool (the TypeScript
// worker under tsx). Status codes and bodies are the contract the editor and scripts rely on.
import { afterAll, describe, expect, it } from 'vitest';
import type { RequestEvent } from '@sveltejs/kit';
import { POST } from '../../src/routes/api/analyze/+server';
import { analyzeInPool, closeAnalysisPool } from '../../src/lib/server/jobs/analysis-pool';
import { LIMITS } from '../../src/lib/server/analysis-request';
import { digitizerDivider } from '../../src/lib/server/db/seed/demo-sheets';

afterAll(closeAnalysisPool);

const someone = { id: '00000000-0000-4000-8000-000000000001', email: 'a@example.test', name: 'A' };

function call(body: string | object, { query = '', user = someone as typeof someone | null } = {}) {
	const url = new URL(`http://127.0.0.1/api/analyze${query}`);
	const request = new Request(url, {
		method: 'POST',
		headers: { 'content-type': 'application/json' },
		body: typeof body === 'string' ? body : JSON.stringify(body)
	});
	const event = {
		request,
		url,
		params: {},
		locals: { user, session: null, auth: user ? 'token' : null }
	};
	return POST(event as unknown as RequestEvent);
}

const lowPass = (r: string | number, c: string | number) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: r },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: c }
	],
	input: 'V1',
	output: { node: 'out' }
});

describe('POST /api/analyze', () => {
	it('answers the analysis: an RC low-pass has its pole at −1/RC (closed form)', async () => {
		const response = await call(lowPass('1k', '1n'), { query: '?points=50' });
		expect(response.status).toBe(200);
		const analysis = await response.json();
		expect(analysis.poles).toHaveLength(1);
		expect(Math.abs(analysis.poles[0].re / -1e6 - 1)).toBeLessThan(1e-9);
		expect(analysis.frequencyResponse.f).toHaveLength(50);
		expect(analysis.dcGain).toBeCloseTo(1, 12);
	});

	it('401 for a caller with neither a session nor an API token', async () => {
		const response = await call(lowPass('1k', '1n'), { user: null });
		expect(response.status).toBe(401);
		expect((await response.json()).error).toMatch(/Sign in or send an API token/);
	});

	it('422 with the element at fault for a value that is not a number (10pp)', async () => {
		const response = await call(lowPass('1k', '10pp'));
		expect(response.status).toBe(422);
		expect(await response.json()).toMatchObject({
			code: 'bad_value',
			element: 'C1',
			error: expect.stringContaining('C1')
		});
	});

	it('400 naming the element for a document of the wrong shape', async () => {
		const doc = lowPass('1k', '1n');
		(doc.elements[1] as { type: string }).type = 'Q';
		const response = await call(doc);
		expect(response.status).toBe(400);
		expect(await response.json()).toMatchObject({
			code: 'bad_document',
			element: 'R1',
			error: expect.stringContaining('element "R1": type')
		});
	});

	it.each([
		['not JSON', '{"schema": 1,', 400, /not valid JSON/],
		['an empty body', '', 400, /./]
	])('400 for %s', async (_name, body, status, message) => {
		const response = await call(body);
		expect(response.status).toBe(status);
		expect((await response.json()).error).toMatch(message);
	});

	it('400 for response options out of range, naming the option', async () => {
		const response = await call(lowPass('1k', '1n'), { query: '?points=1' });
		expect(response.status).toBe(400);
		expect((await response.json()).error).toBe('points must be at least 2');
	});

	it('413 for a body over the size limit and for too many elements', async () => {
		const big = await call('x'.repeat(LIMITS.bodyBytes + 10));
		expect(big.status).toBe(413);
		const many = {
			...lowPass('1k', '1n'),
			elements: Array.from({ length: LIMITS.elements + 1 }, (_, i) => ({
				id: `R${i}`,
				type: 'R',
				nodes: ['in', 'out'],
				value: 1
			}))
		};
		const response = await call(many);
		expect(response.status).toBe(413);
		expect((await response.json()).error).toMatch(
			new RegExp(
				`^the network has ${LIMITS.elements + 1} elements; an analysis is limited to ${LIMITS.elements} elements`
			)
		);
	});

	it('stops an analysis that overruns its time limit with 503, and the server thread stays free meanwhile', async () => {
		// A 400-capacitor ladder takes far longer than 5 ms; the timer below must still fire on time
		// while the worker computes, because the solver never runs on this thread.
		const elements: object[] = [{ id: 'V1', type: 'V', nodes: ['n0', 'gnd'], value: 1 }];
		for (let i = 1; i <= 400; i++) {
			elements.push({ id: `R${i}`, type: 'R', nodes: [`n${i - 1}`, `n${i}`], value: 100 });
			elements.push({ id: `C${i}`, type: 'C', nodes: [`n${i}`, 'gnd'], value: '1n' });
		}
		const doc = { schema: 1, elements, input: 'V1', output: { node: 'n400' } };
		const started = Date.now();
		const timer = new Promise<number>((resolve) =>
			setTimeout(() => resolve(Date.now() - started), 20)
		);
		const run = analyzeInPool({ document: doc, options: {} }, 30);
		expect(await timer).toBeLessThan(200);
		await expect(run).rejects.toMatchObject({ status: 503, details: { code: 'timeout' } });
	});
});

// Issue 13 in the API answer (what the editor and the report draw): the demo divider's parallel
// Ccable and Cadc are one port; every resistance seen carries its formula and the formula's value
// is the reading; the dominant pole's headline estimate names its method; real poles have no Q.
describe('POST /api/analyze: the time-constant view of the demo divider', () => {
	type Formula = { kind: string; formula: string | null; value: number | null };
	type Reading = {
		element: string;
		members: string[];
		value: number;
		resistance: number;
		formula: Formula;
	};

	it('ports as node pairs, a formula for every R seen whose value is the reading, the method named, no Q on real poles', async () => {
		const response = await call(digitizerDivider, { query: '?points=20' });
		expect(response.status).toBe(200);
		const a = await response.json();
		const open: Reading[] = a.timeConstants.openCircuit;
		const short: Reading[] = a.timeConstants.shortCircuit;
		// Capacitances in parallel add (common practice): 42 pF + 18 pF, one port.
		const cable = open.find((t) => t.members.length > 1)!;
		expect(cable.members.sort()).toEqual(['Cadc', 'Ccable']);
		expect(Math.abs(cable.value / 60e-12 - 1)).toBeLessThan(1e-12);
		expect(open).toHaveLength(2);
		for (const t of [...open, ...short]) {
			expect(t.formula.kind).toBe('series-parallel');
			expect(Math.abs(t.formula.value! / t.resistance - 1)).toBeLessThan(1e-12);
		}
		// By hand (common practice): Ctop sees Rtop ∥ (Rsrc + Radc) with the other port open.
		const top = open.find((t) => t.element === 'Ctop')!;
		expect(top.formula.formula).toBe('Rtop ∥ (Rsrc + Radc)');
		expect(Math.abs(top.resistance / ((9e6 * (50 + 1e6)) / (9e6 + 50 + 1e6)) - 1)).toBeLessThan(
			1e-12
		);
		// The dominant pole: headed by −1/b1, within 5 % of the exact pole.
		const p1 = a.poles[0];
		expect(p1.estimate.method).toBe('b1');
		expect(p1.relativeError).toBeLessThan(0.05);
		expect(a.poles.map((p: { im: number; q: number | null }) => [p.im, p.q])).toEqual([
			[0, null],
			[0, null]
		]);
		// The 1.8 % doublet and the Ctop value that closes it (equal R·C on both arms: 6.667 pF).
		expect(a.doublets[0].closing[0].element).toBe('Ctop');
		expect(Math.abs(a.doublets[0].closing[0].to / ((1e6 * 60e-12) / 9e6) - 1)).toBeLessThan(1e-6);
	});
});
