// Touchstone 2.0 export through the route. Layout per the Touchstone File Format Specification
// Version 2.0 (IBIS Open Forum, ratified April 24, 2009): [Version] 2.0, option line,
// [Number of Ports] 2, [Two-Port Data Order] (21_12: N11 N21 N12 N22), [Number of Frequencies],
// [Reference] one per port, [Network Data] … [End]; Z and Y not normalized. Values are read
// back with a reader written from that specification (touchstone-reader.ts) and checked
// against closed forms named beside each check.
import { afterAll, describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { exchangeWorld, send, seriesR, shuntC } from './exchange-helpers';
import { readTouchstone, type Complex } from './touchstone-reader';
import * as touchstone from '../../src/routes/api/sheets/[id=uuid]/touchstone/+server';
import { closeAnalysisPool } from '../../src/lib/server/jobs/analysis-pool';

useDatabase();
afterAll(closeAnalysisPool);

const near = (got: Complex, want: Complex, tol: number) => {
	const scale = Math.max(Math.hypot(want.re, want.im), 1e-300);
	expect(Math.hypot(got.re - want.re, got.im - want.im) / scale).toBeLessThan(tol);
};

async function get(doc: unknown, query: string) {
	const { owner, sheet } = await exchangeWorld(doc);
	return send(touchstone.GET, { user: owner, params: { id: sheet.id }, path: `/x?${query}` });
}

describe('Touchstone 2.0 export', () => {
	it('series resistor: 2.0 keywords in order; S11 = R/(R + 100), S21 = 100/(R + 100) (closed form) read back', async () => {
		const r = await get(
			seriesR('330'),
			'version=2.0&port1=in,gnd&port2=out,gnd&fMin=1e3&fMax=1e6&points=4'
		);
		expect(r.status, r.text).toBe(200);
		expect(/^[\x20-\x7e\r\n]*$/.test(r.text)).toBe(true);
		const lines = r.text.split('\r\n').filter((l) => l && !l.startsWith('!'));
		// 2.0 specification: these keywords, this order, data between [Network Data] and [End].
		expect(lines.slice(0, 7)).toEqual([
			'[Version] 2.0',
			'# Hz S RI R 50',
			'[Number of Ports] 2',
			'[Two-Port Data Order] 21_12',
			'[Number of Frequencies] 4',
			'[Reference] 50 50',
			'[Network Data]'
		]);
		expect(lines.at(-1)).toBe('[End]');
		expect(r.text).toContain('! Polewise two-port export (Touchstone 2.0 layout)');
		const file = readTouchstone(r.text);
		expect(file).toMatchObject({ version: '2.0', parameter: 'S', reference: [50, 50] });
		expect(file.f.map(Math.round)).toEqual([1e3, 1e4, 1e5, 1e6]);
		for (const [[s11, s12], [s21, s22]] of file.n) {
			// Series R between two 50 Ω ports (closed form): S11 = S22 = R/(R + 2·50), S21 = S12 = 2·50/(R + 2·50).
			near(s11, { re: 330 / 430, im: 0 }, 1e-8);
			near(s21, { re: 100 / 430, im: 0 }, 1e-8);
			near(s12, { re: 100 / 430, im: 0 }, 1e-8);
			near(s22, { re: 330 / 430, im: 0 }, 1e-8);
		}
	});

	it('shunt capacitor: S21 = 1/(1 + jωCZ0/2) (closed form) from a 2.0 file in MA and MHz', async () => {
		const f = [1e5, 1e6, 1e7];
		const r = await get(
			shuntC,
			`version=2.0&port1=out,gnd&port2=out,gnd&frequencies=${f.join(',')}&format=MA&unit=MHz`
		);
		expect(r.status, r.text).toBe(200);
		expect(r.text).toContain('\r\n# MHz S MA R 50\r\n');
		expect(r.text).toContain('\r\n[Number of Frequencies] 3\r\n');
		const file = readTouchstone(r.text);
		expect(file.f).toEqual(f);
		file.n.forEach(([, [s21]], i) => {
			const x = (2 * Math.PI * f[i] * 2.2e-9 * 50) / 2;
			// 1/(1 + jx) = (1 − jx)/(1 + x²)
			near(s21, { re: 1 / (1 + x * x), im: -x / (1 + x * x) }, 1e-7);
		});
	});

	it('Z in ohms and Y in siemens, not normalized: shunt C has Z = 1/(jωC), series R has Y11 = 1/R, Y21 = −1/R (closed forms); the 1.1 file reads back the same', async () => {
		const z = await get(
			shuntC,
			'version=2.0&port1=out,gnd&port2=out,gnd&parameter=Z&frequencies=1e6'
		);
		expect(z.status, z.text).toBe(200);
		expect(z.text).toContain('! Z-parameters in ohms, not normalized (Touchstone 2.0)');
		const zc = { re: 0, im: -1 / (2 * Math.PI * 1e6 * 2.2e-9) }; // 1/(jωC) ≈ −j72.3 Ω
		const [[z11, z12], [z21, z22]] = readTouchstone(z.text).n[0];
		for (const v of [z11, z12, z21, z22]) near(v, zc, 1e-7);

		const v2 = await get(
			seriesR('200'),
			'version=2.0&port1=in,gnd&port2=out,gnd&parameter=Y&frequencies=1000'
		);
		expect(v2.status, v2.text).toBe(200);
		const y = readTouchstone(v2.text).n[0];
		near(y[0][0], { re: 1 / 200, im: 0 }, 1e-9);
		near(y[1][0], { re: -1 / 200, im: 0 }, 1e-9);
		// The raw number in the file is in siemens (0.005), where 1.1 writes Y·R = 0.25.
		const data = v2.text.split('\r\n')[v2.text.split('\r\n').indexOf('[Network Data]') + 2];
		expect(Number(data.split(' ')[1])).toBeCloseTo(0.005, 12);

		const v1 = await get(seriesR('200'), 'port1=in,gnd&port2=out,gnd&parameter=Y&frequencies=1000');
		const y1 = readTouchstone(v1.text);
		expect(y1.version).toBe('1.x');
		y1.n[0].forEach((row, i) => row.forEach((c, j) => near(c, y[i][j], 1e-9)));
	});

	it('refuses an unknown version naming the field', async () => {
		const r = await get(seriesR('50'), 'version=3&frequencies=1000');
		expect(r.status).toBe(400);
		expect(r.json.error).toBe('version: version must be 1.1 or 2.0');
	});
});
