// The review report's spec section reads the limits through the design aids' own data verb
// (saveDesignSettings / getDesignSettings), not with a query of its own: limits saved there show
// up with pass/fail in the report, and a sheet without limits says so.
import { afterAll, describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { exchangeWorld } from './exchange-helpers';
import { reportData } from '../../src/lib/server/exchange/report-data';
import { saveDesignSettings } from '../../src/lib/server/db/design-jobs';
import { designSettingsSchema } from '../../src/lib/network/design-schema';
import { closeAnalysisPool } from '../../src/lib/server/jobs/analysis-pool';

useDatabase();
afterAll(closeAnalysisPool);

const url = new URL('http://127.0.0.1/sheets/x/report');

describe('review report: spec limits', () => {
	it('says no limits are set when the design aids keep none for the sheet', async () => {
		const { owner, sheet } = await exchangeWorld();
		const report = await reportData({ kind: 'user', id: owner.id }, sheet.id, url);
		expect(report.spec).toEqual({ outcome: null, note: 'No spec limits are set for this sheet.' });
	});

	it('checks the limits saved through the design aids against the revision (1 kΩ, 1 nF: f-3dB = 1/(2πRC) ≈ 159.2 kHz, closed form)', async () => {
		const { owner, sheet } = await exchangeWorld();
		const settings = designSettingsSchema.parse({
			spec: { bandwidthMin: 100e3, dcGain: { min: 0.99, max: 1.01 } }
		});
		await saveDesignSettings(sheet.id, owner.id, settings);
		const pass = await reportData({ kind: 'user', id: owner.id }, sheet.id, url);
		expect(pass.spec.note).toBeNull();
		expect(pass.spec.outcome?.pass).toBe(true);
		const bandwidth = pass.spec.outcome!.checks.find((c) => c.key === 'bandwidth')!;
		// Single-pole RC low-pass: f-3dB = 1/(2π·1 kΩ·1 nF) = 159 154.9 Hz (closed form).
		expect(Math.abs(bandwidth.value! - 1 / (2 * Math.PI * 1e3 * 1e-9)) / 159154.9).toBeLessThan(
			1e-3
		);
		expect(pass.spec.outcome!.checks.map((c) => c.key).sort()).toEqual(['bandwidth', 'dcGain']);

		// A limit the network misses fails the spec in the report.
		await saveDesignSettings(
			sheet.id,
			owner.id,
			designSettingsSchema.parse({ spec: { bandwidthMin: 200e3 } })
		);
		const fail = await reportData({ kind: 'user', id: owner.id }, sheet.id, url);
		expect(fail.spec.outcome?.pass).toBe(false);
		expect(fail.spec.outcome!.checks).toHaveLength(1);
		expect(fail.spec.outcome!.checks[0]).toMatchObject({ key: 'bandwidth', pass: false });
	});
});
