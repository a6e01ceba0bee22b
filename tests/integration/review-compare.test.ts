// Revision comparison against closed forms. A first-order RC low-pass driven by a voltage source
// has one pole at s = −1/(RC) (closed form: the single time constant τ = RC), its −3 dB frequency
// is 1/(2πRC), and its 10–90 % step rise time is τ·ln 9 ≈ 2.197 τ (closed form of 1 − e^(−t/τ)).
// Doubling R halves the pole: a movement of −50 % in |s|.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld } from './support/fixtures';
import { getRevision, saveRevision } from '../../src/lib/server/db/sheets';
import * as compare from '../../src/routes/api/sheets/[id=uuid]/compare/+server';

useDatabase();

const lowPass = (r: string, c = '1n', extra: object[] = []) => ({
	schema: 1,
	elements: [{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 }, { id: 'R1', type: 'R', nodes: ['in', 'out'], value: r }, { id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: c }, ...extra],
	input: 'V1',
	output: { node: 'out' }
});

const near = (actual: number, expected: number, rel: number) => expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThan(rel);

async function save(userId: string, sheetId: string, document: unknown) {
	const latest = (await getRevision(sheetId))!;
	return saveRevision(userId, sheetId, { document }, latest.number);
}

// A high-pass (C1 in series, R1 to ground) has DC gain 0 and no step figures; a resistor R2
// across C1 gives it a DC path (gain R1/(R1 + R2) = 0.5, closed form) and a step that starts at
// 1 (100 % overshoot of the final 0.5) and decays with τ = (R1 ∥ R2)·C1 = 0.5 µs, settling after
// about τ·ln 100 ≈ 2.3 µs; without C1 the divider settles at once (settling time 0).
const highPass = (extra: object[] = [], withC = true) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		...(withC ? [{ id: 'C1', type: 'C', nodes: ['in', 'out'], value: '1n' }] : []),
		{ id: 'R1', type: 'R', nodes: ['out', 'gnd'], value: '1k' },
		...extra
	],
	input: 'V1',
	output: { node: 'out' }
});

describe('revision comparison: changes at or near zero, and figures that appear or disappear', () => {
	it('says absolute changes from zero, no change at zero, and appears/gone in words — never −100 %', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const r2 = { id: 'R2', type: 'R', nodes: ['in', 'out'], value: '1k' };
		await save(world.owner.id, sheet.id, highPass()); // 2
		await save(world.owner.id, sheet.id, highPass([r2])); // 3
		await save(world.owner.id, sheet.id, highPass([r2], false)); // 4
		const get = async (from: number, to: number) => {
			const res = await call(compare.GET, { user: world.viewer, params: { id: sheet.id }, path: `/api/sheets/${sheet.id}/compare?from=${from}&to=${to}` });
			expect(res.status).toBe(200);
			return Object.fromEntries(res.body.figures.map((f: { key: string }) => [f.key, f]));
		};
		const a = await get(2, 3);
		expect(a.dcGain).toMatchObject({ unit: 'V/V', before: 0, changePct: null, change: { kind: 'absolute' } });
		near(a.dcGain.change.absolute, 0.5, 1e-9);
		expect(a.highFrequencyGain.change).toEqual({ kind: 'same' });
		expect(a.riseTime.change).toEqual({ kind: 'appears' });
		expect(a.settlingTime.change).toEqual({ kind: 'appears' });
		expect(a.bandwidth.change).toEqual({ kind: 'none' });
		const b = await get(3, 4);
		// Settling time 2.3 µs → 0: an absolute change, not −100 %.
		expect(b.settlingTime).toMatchObject({ after: 0, changePct: null, change: { kind: 'absolute' } });
		expect(b.settlingTime.change.absolute).toBeLessThan(0);
		expect(b.overshoot).toMatchObject({ changePct: null, change: { kind: 'absolute' } });
		near(b.overshoot.change.absolute, -100, 1e-9);
	});
});

describe('revision comparison', () => {
	it('R1 1 kΩ → 2 kΩ: exactly R1 changed, the pole moves from −1/RC to −1/(2RC), figures follow', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		await save(world.owner.id, sheet.id, lowPass('1k'));
		await save(world.owner.id, sheet.id, lowPass('2k'));
		const res = await call(compare.GET, { user: world.viewer, params: { id: sheet.id }, path: `/api/sheets/${sheet.id}/compare?from=2&to=3` });
		expect(res.status).toBe(200);
		expect(res.body.elements).toEqual({ added: [], removed: [], changed: [{ id: 'R1', type: 'R', changes: [{ field: 'value', from: '1k', to: '2k' }] }], ports: [] });

		const [tauBefore, tauAfter] = [1e3 * 1e-9, 2e3 * 1e-9];
		expect(res.body.poles).toHaveLength(1);
		const [p] = res.body.poles;
		// Closed form: s = −1/(RC); relative tolerance 1e-9 (an exact first-order network).
		near(p.before.re, -1 / tauBefore, 1e-9);
		near(p.after.re, -1 / tauAfter, 1e-9);
		expect(p.before.im).toBe(0);
		near(p.movementPct, -50, 1e-9);

		const fig = Object.fromEntries(res.body.figures.map((f: { key: string }) => [f.key, f]));
		// DC gain of the divider-free low-pass is exactly 1 (closed form).
		near(fig.dcGain.before, 1, 1e-9);
		// −3 dB at 1/(2πRC); the solver finds it numerically, so 1e-4.
		near(fig.bandwidth.before, 1 / (2 * Math.PI * tauBefore), 1e-4);
		near(fig.bandwidth.after, 1 / (2 * Math.PI * tauAfter), 1e-4);
		near(fig.bandwidth.changePct, -50, 1e-3);
		// Rise time 10–90 % = τ ln 9 (closed form of the first-order step); sampled, so 1e-3.
		near(fig.riseTime.before, tauBefore * Math.log(9), 1e-3);
		near(fig.riseTime.after, tauAfter * Math.log(9), 1e-3);
		// A first-order step never overshoots.
		expect(fig.overshoot.before).toBe(0);
	});

	it('lists added and removed parts and port changes, and pairs an unmatched new pole with nothing', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		await save(world.owner.id, sheet.id, lowPass('1k'));
		// A second RC section: R2 then C2 at a new output node.
		await save(world.owner.id, sheet.id, {
			...lowPass('1k', '1n', [{ id: 'R2', type: 'R', nodes: ['out', 'out2'], value: '10k' }, { id: 'C2', type: 'C', nodes: ['out2', 'gnd'], value: '100p' }]),
			output: { node: 'out2' }
		});
		const res = await call(compare.GET, { user: world.owner, params: { id: sheet.id }, path: `/api/sheets/${sheet.id}/compare?from=2&to=3` });
		expect(res.body.elements.added).toEqual([{ id: 'R2', type: 'R', value: '10k' }, { id: 'C2', type: 'C', value: '100p' }]);
		expect(res.body.elements.changed).toEqual([]);
		expect(res.body.elements.removed).toEqual([]);
		expect(res.body.elements.ports).toEqual(['output out against gnd → out2 against gnd']);
		expect(res.body.poles).toHaveLength(2);
		expect(res.body.poles.filter((m: { before: unknown }) => m.before === null)).toHaveLength(1);
		const back = await call(compare.GET, { user: world.owner, params: { id: sheet.id }, path: `/api/sheets/${sheet.id}/compare?from=3&to=2` });
		expect(back.body.elements.removed.map((e: { id: string }) => e.id)).toEqual(['R2', 'C2']);
	});

	it('removing a load on the output is a removal, not a change of the output', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		await save(world.owner.id, sheet.id, lowPass('1k', '1n', [{ id: 'RL', type: 'R', nodes: ['out', 'gnd'], value: '1M' }]));
		await save(world.owner.id, sheet.id, lowPass('1k'));
		const res = await call(compare.GET, { user: world.owner, params: { id: sheet.id }, path: `/api/sheets/${sheet.id}/compare?from=2&to=3` });
		expect(res.body.elements).toEqual({ added: [], removed: [{ id: 'RL', type: 'R', value: '1M' }], changed: [], ports: [] });
	});

	it('answers 400 for a bad query, 404 for a missing revision or a stranger', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const ask = (query: string, user = world.owner) => call(compare.GET, { user, params: { id: sheet.id }, path: `/api/sheets/${sheet.id}/compare${query}` });
		expect((await ask('?from=1')).body.error).toBe('to: to must be a revision number');
		expect((await ask('?from=1&to=1')).body.error).toBe('from and to must be two different revisions.');
		expect((await ask('?from=1&to=9')).status).toBe(404);
		expect((await ask('?from=1&to=2', world.outsider)).status).toBe(404);
	});
});
