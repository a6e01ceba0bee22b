// A large network in the browser (issue 15): a compressed sheet file of a 1,600-section RC
// ladder (3,201 elements, above the interactive size) imports through the workspace page, opens
// as a netlist (no canvas), and its analysis runs as a background job with a progress bar and a
// cancel button; the dominant poles and every open-circuit τ appear. The closed forms checked
// here: the ladder's slowest pole −4·sin²(π/(2(2n+1)))/(RC) (Yueh 2005) and τ of capacitor k =
// k·R·C (by inspection). The 100,000-element run is in docs/performance.md (too long for CI).
import { gzipSync } from 'node:zlib';
import { expect, test } from '@playwright/test';
import { signInAs } from './exchange-support';
import { artifact } from './artifacts';

const n = 1600;
const R = 1e3;
const C = 1e-9;
function ladder() {
	const elements = [{ id: 'Vin', type: 'V', nodes: ['x0', 'gnd'], value: 1 }];
	for (let i = 1; i <= n; i++)
		elements.push(
			{ id: `R${i}`, type: 'R', nodes: [`x${i - 1}`, `x${i}`], value: R },
			{ id: `C${i}`, type: 'C', nodes: [`x${i}`, 'gnd'], value: C }
		);
	return {
		schema: 1,
		title: 'Trace model, 1,600 sections',
		elements,
		input: 'Vin',
		output: { node: `x${n}` }
	};
}

test('large sheet: compressed import, netlist view, queued analysis with progress and results', async ({
	page
}) => {
	test.setTimeout(240_000);
	await signInAs(page);
	const ws = await page.request.post('/api/workspaces', {
		data: { name: `Large bench ${Date.now()}` }
	});
	const { workspace } = await ws.json();
	await page.goto(`/workspaces/${workspace.id}`);
	await page.waitForLoadState('networkidle');
	const box = page.getByRole('region', { name: 'Import a sheet file' });
	await box.getByLabel('Sheet file').setInputFiles({
		name: 'trace-1600.json.gz',
		mimeType: 'application/gzip',
		buffer: gzipSync(JSON.stringify(ladder()))
	});
	await box.getByRole('button', { name: 'Import as a new sheet' }).click();
	await page.waitForURL((u) => u.pathname.startsWith('/sheets/'), { timeout: 60_000 });
	await expect(page.getByRole('heading', { name: 'Netlist — 3,201 elements' })).toBeVisible();
	// The element table searches the whole netlist, one page at a time.
	await page.getByLabel('Search by id, type, node or value').fill('C1600');
	await expect(page.getByRole('table', { name: 'Elements' }).getByRole('row')).toHaveCount(2);

	const analyze = page.getByRole('button', { name: 'Analyze' });
	await expect(analyze).toBeEnabled();
	await page.getByLabel('Dominant poles to compute').fill('5');
	await analyze.click();
	const bar = page.getByRole('progressbar', { name: 'Analysis progress' });
	await expect(bar).toBeVisible();
	await expect(page.getByRole('button', { name: 'Cancel' })).toBeVisible();
	await expect(page.getByText('Done.')).toBeVisible({ timeout: 180_000 });
	await expect(bar).toHaveAttribute('aria-valuenow', '100');

	const poles = page.getByRole('table', { name: 'Dominant poles' });
	await expect(poles.getByRole('row')).toHaveCount(6);
	await expect(page.getByRole('region', { name: 'Dominant poles' })).toContainText(
		'poles nearest the origin (the slowest)'
	);
	// The slowest pole against the closed form, read back from the API answer (full precision).
	const jobs = await (
		await page.request.get(`/api/design/sheets/${page.url().split('/').pop()}/jobs`)
	).json();
	const job = await (await page.request.get(`/api/design/jobs/${jobs.jobs[0].id}`)).json();
	const a = job.job.result.analysis;
	expect(a.poleSet).toEqual({ method: 'lanczos', total: n, computed: 5, shift: 0 });
	const lambda = 4 * Math.sin(Math.PI / (2 * (2 * n + 1))) ** 2;
	expect(Math.abs(a.poles[0].re + lambda / (R * C)) / (lambda / (R * C))).toBeLessThan(1e-9);
	expect(a.timeConstants.openCircuit).toHaveLength(n);
	expect(Math.abs(a.timeConstants.openCircuit[n - 1].tau - n * R * C) / (n * R * C)).toBeLessThan(
		1e-12
	);
	// The τ table searches too.
	await page.getByLabel('Search by port').fill('C800');
	await expect(page.getByRole('table', { name: 'Open-circuit time constants' })).toContainText(
		'800 µs'
	);
	await expect(page.getByRole('complementary', { name: 'Safety caution' })).toBeVisible();
	await page.screenshot({ path: artifact('large-network-results.png'), fullPage: false });
});
