// A sheet with variants through review: the spec judged per variant and across variants (the
// design aids' endpoint and every stored revision), the comparison of two revisions variant by
// variant, the report's variant sections, and "changed since approval" when only an override
// changed. The sheet is the lab's demo divider: three range positions and two cable options.
import { afterAll, describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { person } from './support/fixtures';
import { call } from './support/handlers';
import { createWorkspace } from '../../src/lib/server/db/workspaces';
import { createSheet, getRevision, saveRevision } from '../../src/lib/server/db/sheets';
import { saveDesignSettings } from '../../src/lib/server/db/design-jobs';
import { digitizerDividerRanges, dividerSettings } from '../../src/lib/server/db/seed/demo-sheets';
import { compareRevisions } from '../../src/lib/server/review/compare';
import { compareSpec } from '../../src/lib/server/review/spec-compare';
import { sameNetwork } from '../../src/lib/server/review/wiring';
import { reportData } from '../../src/lib/server/exchange/report-data';
import { closeAnalysisPool } from '../../src/lib/server/jobs/analysis-pool';
import { closeDesignPool } from '../../src/lib/server/jobs/design-pool';
import * as variantSpec from '../../src/routes/api/design/variant-spec/+server';
import * as revisionAnalysis from '../../src/routes/api/sheets/[id=uuid]/revisions/[n=revision]/analysis/+server';
import type { NetworkDocument } from '../../src/lib/network/schema';

useDatabase();
afterAll(async () => {
	await closeAnalysisPool();
	await closeDesignPool();
});

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

async function world() {
	const ana = await person('Ana');
	const ws = await createWorkspace(ana.id, 'Range bench');
	const { sheet } = await createSheet({
		userId: ana.id,
		workspaceId: ws.id,
		name: 'Divider',
		document: digitizerDividerRanges
	});
	await saveDesignSettings(sheet.id, ana.id, dividerSettings);
	return { ana, sheet, actor: { kind: 'user' as const, id: ana.id } };
}

/** Revision 2: each position's top capacitor at its closed-form compensation (1.2 m cable). */
function compensated(): NetworkDocument {
	const doc = structuredClone(digitizerDividerRanges) as unknown as NetworkDocument;
	const shunt = (rsh: number | null, csh: number) => ({
		r: 1 / (1e-6 + (rsh ? 1 / rsh : 0)),
		c: csh + 42e-12 + 18e-12
	});
	const ctop = (rtop: number, rsh: number | null, csh: number) =>
		(shunt(rsh, csh).r * shunt(rsh, csh).c) / rtop;
	doc.elements.find((e) => e.id === 'Ctop')!.value = ctop(9e6, null, 0);
	doc.variants!.groups[0].options[1].values!.Ctop = ctop(9.9e6, 111.1e3, 540e-12);
	doc.variants!.groups[0].options[2].values!.Ctop = ctop(9.99e6, 10.1e3, 5940e-12);
	return doc;
}

describe('variants through review', () => {
	it('POST /api/design/variant-spec judges every variant and the specs across them', async () => {
		const { ana } = await world();
		const r = await call(variantSpec.POST, {
			user: ana,
			method: 'POST',
			body: { document: compensated(), ...dividerSettings }
		});
		expect(r.status).toBe(200);
		expect(r.body.variants).toHaveLength(6);
		// 10 MΩ everywhere (9M + 1M, 9.9M + 100k, 9.99M + 10k), steps 1 : 10 : 100 from the resistors.
		const [rin, steps, cin] = r.body.across;
		expect(rin.pass).toBe(true);
		expect(steps.pass).toBe(true);
		// Input capacitance within 5 % across Range: 6.0 pF in every position on the 1.2 m cable.
		expect(cin.sets.map((s: { within: string; pass: boolean }) => [s.within, s.pass])).toEqual([
			['1.2 m cable', true],
			['2 m cable', true]
		]);
		const bad = await call(variantSpec.POST, {
			user: ana,
			method: 'POST',
			body: {
				document: compensated(),
				across: [
					{ kind: 'ratio', figure: 'dcGain', group: 'Range', ratios: { '10:1': 1 }, tolerance: 0.1 }
				]
			}
		});
		expect(bad.status).toBe(400);
		expect(bad.body.error).toMatch(/at least two options/);
	});

	it('a stored revision is judged per variant: the seeded positions fail the input-capacitance spec, the compensated ones pass', async () => {
		const { ana, sheet, actor } = await world();
		await saveRevision(
			ana.id,
			sheet.id,
			{ document: compensated(), message: 'compensated per position' },
			1
		);
		const spec = await compareSpec(actor, sheet.id, 1, 2);
		const cinBefore = spec.variantsBefore!.across[2];
		const cinAfter = spec.variantsAfter!.across[2];
		expect(cinBefore.pass).toBe(false); // 6.8 p / 6.2 p / 5.6 p tops: 5.6–6.1 pF, 9.7 % apart
		expect(cinAfter.pass).toBe(true);
		// Each limit in each variant: with the 2 m cable the 10:1 position, compensated for the
		// 1.2 m one, has a step droop of C_top/(C_top + 88 pF) against 0.1 — 3.0 dB — so its
		// magnitude crosses −3 dB far below 20 MHz; every other variant meets ≥ 20 MHz and ≥ 9 MΩ.
		const failing = spec.variantsAfter!.variants.filter((v) => !v.spec!.pass);
		expect(failing.map((v) => v.name)).toEqual(['10:1 · 2 m cable']);
		expect(failing[0].spec!.checks.find((c) => !c.pass)!.key).toBe('bandwidth');
	});

	it('the comparison moves each variant by its own overrides', async () => {
		const { ana, sheet, actor } = await world();
		await saveRevision(ana.id, sheet.id, { document: compensated() }, 1);
		const c = await compareRevisions(actor, sheet.id, 1, 2);
		expect(c.variants!.map((v) => v.name)).toHaveLength(6);
		const v100 = c.variants!.find((v) => v.name === '100:1 · 1.2 m cable')!;
		expect(v100.on).toBe('both');
		// In 100:1 the change is its own Ctop override: 6.2p → 6.06 pF; nothing else changed there.
		expect(v100.elements!.changed.map((e) => e.id)).toEqual(['Ctop']);
		expect(v100.elements!.changed[0].changes[0].from).toBe('6.2p');
		expect(rel(Number(v100.elements!.changed[0].changes[0].to), 6.0601e-12)).toBeLessThan(1e-3);
		expect(v100.elements!.added).toEqual([]);
	});

	it('the report has the variants side by side, the spec across them and a section per variant', async () => {
		const { actor, sheet } = await world();
		const report = await reportData(actor, sheet.id, new URL('http://127.0.0.1/sheets/x/report'));
		expect(report.variants!.list.map((v) => v.name)).toEqual([
			'10:1 · 1.2 m cable',
			'10:1 · 2 m cable',
			'100:1 · 1.2 m cable',
			'100:1 · 2 m cable',
			'1000:1 · 1.2 m cable',
			'1000:1 · 2 m cable'
		]);
		const v = report.variants!.list[5];
		// In the drawing's order of parts, whatever order the stored JSON keeps its keys in.
		expect(v.overrides).toEqual([
			'Rtop = 9.99M (Range: 1000:1)',
			'Ctop = 5.6p (Range: 1000:1)',
			'Ccable = 70p (Cable: 2 m cable)',
			'Rsh = 10.1k (Range: 1000:1)',
			'Csh = 5940p (Range: 1000:1)',
			'Rsh put in',
			'Csh put in'
		]);
		// Closed form (divider): 1M ∥ 10.1k against 9.99M plus the 50 Ω source.
		const sh = 1 / (1e-6 + 1 / 10.1e3);
		expect(rel(v.analysis!.dcGain!, sh / (50 + 9.99e6 + sh))).toBeLessThan(1e-9);
		expect(report.variants!.spec!.across).toHaveLength(3);
	});

	it('a stored revision analyses as its base, one variant or all of them', async () => {
		const { ana, sheet } = await world();
		const get = (query: string) =>
			call(revisionAnalysis.GET, {
				user: ana,
				params: { id: sheet.id, n: '1' },
				path: `/api/sheets/${sheet.id}/revisions/1/analysis${query}`
			});
		// Closed form (divider): the base is 10:1, 1M against 9M plus the 50 Ω source.
		const base = await get('');
		expect(base.status).toBe(200);
		expect(rel(base.body.analysis.dcGain, 1e6 / (50 + 9e6 + 1e6))).toBeLessThan(1e-9);
		const one = await get(`?variant=${encodeURIComponent('100:1 · 2 m cable')}`);
		expect(one.body.variant).toBe('100:1 · 2 m cable');
		const sh = 1 / (1e-6 + 1 / 111.1e3);
		expect(rel(one.body.analysis.dcGain, sh / (50 + 9.9e6 + sh))).toBeLessThan(1e-9);
		const all = await get('?variants=all');
		expect(all.body.variants).toHaveLength(6);
		expect((await get('?variant=nope')).status).toBe(422);
	});

	it('changing only an override changes the network a sign-off covered', async () => {
		const { ana, sheet } = await world();
		const doc = structuredClone(digitizerDividerRanges) as unknown as NetworkDocument;
		doc.variants!.groups[1].options[1].values!.Ccable = '80p';
		await saveRevision(ana.id, sheet.id, { document: doc }, 1);
		const [a, b] = [await getRevision(sheet.id, 1), await getRevision(sheet.id, 2)];
		expect(sameNetwork(a!.document as NetworkDocument, b!.document as NetworkDocument)).toBe(false);
		expect(sameNetwork(a!.document as NetworkDocument, a!.document as NetworkDocument)).toBe(true);
	});
});
