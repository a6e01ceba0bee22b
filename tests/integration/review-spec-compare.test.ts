// Spec pass/fail on two revisions, as the comparison and the review answer show it. A first-order
// RC low-pass driven by a voltage source: −3 dB at 1/(2πRC) and a 10–90 % rise time of τ·ln 9
// (closed forms of the single time constant τ = RC), DC gain exactly 1. Doubling R from 1 kΩ to
// 2 kΩ (C = 1 nF) moves the bandwidth from 159.2 kHz to 79.6 kHz and the rise time from 2.20 µs
// to 4.39 µs, so a 100 kHz / 3 µs spec passes before and fails after.
import { afterAll, describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { matrixWorld } from './support/fixtures';
import { getRevision, saveRevision } from '../../src/lib/server/db/sheets';
import { saveDesignSettings } from '../../src/lib/server/db/design-jobs';
import { closeDesignPool } from '../../src/lib/server/jobs/design-pool';
import { answerSpec, compareSpec } from '../../src/lib/server/review/spec-compare';
import { answerReview, createReviewRequest } from '../../src/lib/server/db/reviews';
import { AccessDenied } from '../../src/lib/server/access';
import { designSettingsSchema } from '../../src/lib/network/design-schema';

useDatabase();
afterAll(() => closeDesignPool());

const lowPass = (r: string, extra: object[] = []) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: r },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '1n' },
		...extra
	],
	input: 'V1',
	output: { node: 'out' }
});

async function save(userId: string, sheetId: string, document: unknown) {
	const latest = (await getRevision(sheetId))!;
	return saveRevision(userId, sheetId, { document }, latest.number);
}

const user = (p: { id: string }) => ({ kind: 'user' as const, id: p.id });
const spec = { bandwidthMin: 100e3, riseTimeMax: 3e-6, dcGain: { min: 0.99, max: 1.01 } };

async function twoRevisions() {
	const world = await matrixWorld();
	const { sheet } = await world.sheet('Spec RC');
	await save(world.owner.id, sheet.id, lowPass('1k')); // revision 2
	await save(world.owner.id, sheet.id, lowPass('2k')); // revision 3
	return { world, sheet };
}

describe('spec pass/fail across two revisions', () => {
	it('every limit line with its value and verdict before and after; what broke is named', async () => {
		const { world, sheet } = await twoRevisions();
		await saveDesignSettings(sheet.id, world.owner.id, designSettingsSchema.parse({ spec }));
		const c = await compareSpec(user(world.commenter), sheet.id, 2, 3);
		expect(c.lines.map((l) => [l.key, l.before?.pass, l.after?.pass, l.turn])).toEqual([
			['bandwidth', true, false, 'broke'],
			['riseTime', true, false, 'broke'],
			['dcGain', true, true, 'kept']
		]);
		const bw = c.lines[0];
		expect(bw.limit).toBe('≥ 100 kHz');
		// Closed form 1/(2πRC); the evaluator finds the −3 dB point numerically: 1e-4 relative.
		expect(bw.before!.value! / (1 / (2 * Math.PI * 1e-6))).toBeCloseTo(1, 4);
		expect(bw.after!.value! / (1 / (2 * Math.PI * 2e-6))).toBeCloseTo(1, 4);
		// Rise time τ·ln 9 (closed form), sampled: 1e-3 relative.
		expect(c.lines[1].after!.value! / (2e-6 * Math.log(9))).toBeCloseTo(1, 3);
		expect([c.passBefore, c.passAfter, c.errorBefore, c.errorAfter]).toEqual([
			true,
			false,
			null,
			null
		]);

		// The other way round the same change fixes both lines.
		const back = await compareSpec(user(world.viewer), sheet.id, 3, 2);
		expect(back.lines.map((l) => l.turn)).toEqual(['fixed', 'fixed', 'kept']);
	});

	it('no limits: no lines and no verdict', async () => {
		const { world, sheet } = await twoRevisions();
		const c = await compareSpec(user(world.owner), sheet.id, 2, 3);
		expect(c).toMatchObject({ lines: [], passBefore: null, passAfter: null });
	});

	it('a revision the solver refuses is reported, the other side still judged', async () => {
		const { world, sheet } = await twoRevisions();
		await saveDesignSettings(sheet.id, world.owner.id, designSettingsSchema.parse({ spec }));
		// V2 in parallel with V1 sets node "in" twice: the nodal matrix is singular, no analysis.
		await save(
			world.owner.id,
			sheet.id,
			lowPass('1k', [{ id: 'V2', type: 'V', nodes: ['in', 'gnd'], value: 2 }])
		);
		const c = await compareSpec(user(world.owner), sheet.id, 2, 4);
		expect(c.errorBefore).toBeNull();
		expect(c.errorAfter).toMatch(/singular|V2|V1/i);
		expect(c.lines.map((l) => [l.key, l.before?.pass, l.after])).toEqual([
			['bandwidth', true, null],
			['riseTime', true, null],
			['dcGain', true, null]
		]);
		expect([c.passBefore, c.passAfter]).toEqual([true, null]);
	});

	it('the review answer judges the asked revision against the last signed-off one, else the one before', async () => {
		const { world, sheet } = await twoRevisions();
		await saveDesignSettings(sheet.id, world.owner.id, designSettingsSchema.parse({ spec }));
		const ask = (revisionNumber: number) =>
			createReviewRequest({
				sheetId: sheet.id,
				revisionNumber,
				requestedBy: world.owner.id,
				message: '',
				dueOn: null,
				reviewerIds: [world.commenter.id]
			});
		// Nobody asked the commenter yet: nothing to show.
		expect(await answerSpec(user(world.commenter), sheet.id)).toBeNull();
		const first = await ask(2);
		const a = await answerSpec(user(world.commenter), sheet.id);
		expect([a!.from, a!.to]).toEqual([1, 2]);
		// Revision 1 is the fixture's 9 MΩ low-pass: 17.7 Hz (closed form 1/(2πRC)), far below 100 kHz.
		expect(a!.lines[0]).toMatchObject({ key: 'bandwidth', turn: 'fixed' });
		await answerReview(first, world.commenter.id, 'approve', 'fine');
		await ask(3);
		const b = await answerSpec(user(world.commenter), sheet.id);
		expect([b!.from, b!.to]).toEqual([2, 3]);
		expect(b!.lines.map((l) => l.turn)).toEqual(['broke', 'broke', 'kept']);
		// The viewer was not asked.
		expect(await answerSpec(user(world.viewer), sheet.id)).toBeNull();
	});

	it('a first revision is judged alone', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet('Spec RC alone');
		await saveDesignSettings(
			sheet.id,
			world.owner.id,
			designSettingsSchema.parse({ spec: { bandwidthMin: 10 } })
		);
		const c = await compareSpec(user(world.owner), sheet.id, null, 1);
		// 9 MΩ · 1 nF: 1/(2πRC) = 17.7 Hz (closed form), above 10 Hz; the value itself to 1e-4.
		expect(c.lines).toMatchObject([
			{ key: 'bandwidth', before: null, after: { pass: true }, turn: 'kept' }
		]);
		expect(c.lines[0].after!.value! / (1 / (2 * Math.PI * 9e-3))).toBeCloseTo(1, 4);
		expect([c.passBefore, c.passAfter]).toEqual([null, true]);
	});

	it('someone outside the workspace gets not-found', async () => {
		const { world, sheet } = await twoRevisions();
		await expect(compareSpec(user(world.outsider), sheet.id, 2, 3)).rejects.toBeInstanceOf(
			AccessDenied
		);
	});
});
