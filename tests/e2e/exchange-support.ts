// Steps the exchange browser tests share: a fresh account, a sheet made through the JSON API,
// and a measured response computed from a closed form.
import { expect, type Page } from '@playwright/test';

/**
 * Sign in as one of the seeded demo people. Sign-ups are limited per address (10 an hour) and
 * the whole browser suite shares 127.0.0.1, so these tests sign in instead of signing up; each
 * test still works in a workspace of its own (made in sheetWith).
 */
export async function signInAs(page: Page, who: 'demo' | 'reviewer' = 'demo') {
	const [email, password] =
		who === 'demo'
			? ['demo@polewise.test', 'polewise-demo']
			: ['reviewer@polewise.test', 'polewise-review'];
	await page.goto('/sign-in');
	// Fill only once the form is hydrated (a fill before hydration can be wiped).
	await page.waitForLoadState('networkidle');
	await page.getByLabel('E-mail address').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}

export async function sheetWith(page: Page, document: unknown, name: string) {
	const ws = await page.request.post('/api/workspaces', {
		data: { name: `Exchange bench ${Date.now()}` }
	});
	expect(ws.status()).toBe(201);
	const { workspace } = await ws.json();
	const sh = await page.request.post(`/api/workspaces/${workspace.id}/sheets`, {
		data: { name, document }
	});
	expect(sh.status()).toBe(201);
	return { sheetId: (await sh.json()).sheet.id as string, workspaceId: workspace.id as string };
}

/** The 10:1 probe on a scope input, driven from 50 Ω (the solver issue's reference network). */
export const probe = {
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rsrc', type: 'R', nodes: ['src', 'a'], value: '50' },
		{ id: 'Rt', type: 'R', nodes: ['a', 'b'], value: '9M' },
		{ id: 'Ct', type: 'C', nodes: ['a', 'b'], value: '10p' },
		{ id: 'Rin', type: 'R', nodes: ['b', 'gnd'], value: '1M' },
		{ id: 'Cin', type: 'C', nodes: ['b', 'gnd'], value: '90p' }
	],
	input: 'Vin',
	output: { node: 'b' }
};

/** RC low-pass, 1 kΩ and 1 nF: corner 1/(2πRC) ≈ 159.15 kHz (closed form). */
export const lowPass = {
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '1k' },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '1n' }
	],
	input: 'V1',
	output: { node: 'out' }
};

/**
 * |H| of that low-pass, 20·log10(1/√(1 + (f/fc)²)) (closed form), plus `offsetDb`, as a CSV in
 * the semicolon / decimal-comma style of some bench instruments, frequencies in kHz.
 */
export function lowPassCsv(offsetDb: number, points = 31): string {
	const fc = 1 / (2 * Math.PI * 1e3 * 1e-9);
	const rows = Array.from({ length: points }, (_, i) => {
		const f = 10 ** (3 + (3 * i) / (points - 1)); // 1 kHz … 1 MHz
		const db = -10 * Math.log10(1 + (f / fc) ** 2) + offsetDb;
		const ph = (-Math.atan(f / fc) * 180) / Math.PI;
		return [(f / 1e3).toFixed(6), db.toFixed(6), ph.toFixed(4)]
			.map((v) => v.replace('.', ','))
			.join(';');
	});
	return ['Frequency (kHz);Gain (dB);Phase (deg)', ...rows].join('\r\n') + '\r\n';
}
