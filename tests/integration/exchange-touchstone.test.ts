// Touchstone and results CSV through the routes, on stored revisions. Touchstone values are
// checked against closed forms (named beside each) and the file against the version 1.1 layout
// of the Touchstone File Format Specification (IBIS Open Forum).
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { exchangeWorld, send, seriesR, shuntC } from './exchange-helpers';
import * as touchstone from '../../src/routes/api/sheets/[id=uuid]/touchstone/+server';
import * as results from '../../src/routes/api/sheets/[id=uuid]/export/[file]/+server';
import { closeAnalysisPool } from '../../src/lib/server/jobs/analysis-pool';
import { afterAll } from 'vitest';

useDatabase();
afterAll(closeAnalysisPool);

const dataLines = (text: string) =>
	text.split('\r\n').filter((l) => l && !l.startsWith('!') && !l.startsWith('#'));
const numbers = (line: string) => line.trim().split(/\s+/).map(Number);
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('Touchstone export', () => {
	it('series resistor between 50 Ω ports: S11 = R/(R + 100), S21 = 100/(R + 100) (closed form), in the v1.1 layout', async () => {
		const { owner, sheet } = await exchangeWorld(seriesR('330'));
		const r = await send(touchstone.GET, {
			user: owner,
			params: { id: sheet.id },
			path: '/x?port1=in,gnd&port2=out,gnd&fMin=1e3&fMax=1e6&points=4'
		});
		expect(r.status, r.text).toBe(200);
		expect(r.headers.get('content-disposition')).toMatch(
			/attachment; filename="Low-pass-160-kHz-r1.s2p"/
		);
		const lines = r.text.split('\r\n');
		const option = lines.findIndex((l) => l.startsWith('#'));
		expect(lines[option]).toBe('# Hz S RI R 50');
		expect(lines.slice(0, option).every((l) => l.startsWith('!'))).toBe(true);
		expect(lines.filter((l) => l.startsWith('#'))).toHaveLength(1);
		expect(/^[\x20-\x7e\r\n]*$/.test(r.text)).toBe(true);
		const data = dataLines(r.text);
		expect(data).toHaveLength(4);
		for (const line of data) {
			const [f, s11r, s11i, s21r, s21i, s12r, , s22r] = numbers(line);
			expect(numbers(line)).toHaveLength(9); // frequency + S11 S21 S12 S22 as re/im pairs
			expect(f).toBeGreaterThan(0);
			expect(rel(s11r, 330 / 430)).toBeLessThan(1e-8);
			expect(Math.abs(s11i)).toBeLessThan(1e-9);
			expect(rel(s21r, 100 / 430)).toBeLessThan(1e-8);
			expect(Math.abs(s21i)).toBeLessThan(1e-9);
			expect(rel(s12r, 100 / 430)).toBeLessThan(1e-8);
			expect(rel(s22r, 330 / 430)).toBeLessThan(1e-8);
		}
	});

	it('shunt capacitor: S21 = 1/(1 + jωCZ0/2) (closed form), both ports on the same node pair', async () => {
		const { owner, sheet } = await exchangeWorld(shuntC);
		const r = await send(touchstone.GET, {
			user: owner,
			params: { id: sheet.id },
			path: '/x?port1=out,gnd&port2=out,gnd&frequencies=1e5,1e6,1e7&format=RI&unit=MHz'
		});
		expect(r.status, r.text).toBe(200);
		expect(r.text).toContain('# MHz S RI R 50');
		dataLines(r.text).forEach((line, i) => {
			const [fMHz, , , s21r, s21i] = numbers(line);
			const f = [1e5, 1e6, 1e7][i];
			expect(fMHz).toBe(f / 1e6);
			const x = (2 * Math.PI * f * 2.2e-9 * 50) / 2;
			expect(rel(s21r, 1 / (1 + x * x))).toBeLessThan(1e-7);
			expect(rel(s21i, -x / (1 + x * x))).toBeLessThan(1e-7);
		});
	});

	it('Y of a series resistor is ±1/R (closed form), written normalized as Y·R0; its Z does not exist (422, no numbers)', async () => {
		const { owner, sheet } = await exchangeWorld(seriesR('200'));
		const y = await send(touchstone.GET, {
			user: owner,
			params: { id: sheet.id },
			path: '/x?port1=in,gnd&port2=out,gnd&parameter=Y&frequencies=1000'
		});
		expect(y.status, y.text).toBe(200);
		expect(y.text).toContain('# Hz Y RI R 50');
		const [, y11, , y21] = numbers(dataLines(y.text)[0]);
		expect(rel(y11, 50 / 200)).toBeLessThan(1e-9);
		expect(rel(y21, -50 / 200)).toBeLessThan(1e-9);
		const z = await send(touchstone.GET, {
			user: owner,
			params: { id: sheet.id },
			path: '/x?port1=in,gnd&port2=out,gnd&parameter=Z&frequencies=1000'
		});
		expect(z.status).toBe(422);
		expect(z.json).toMatchObject({ code: 'no_z_parameters', frequency: 1000 });
		expect(z.json.error).toMatch(/Z-parameters do not exist/);
	});

	it('POST with a JSON body; 400 naming a bad field; 422 for a port node the network lacks', async () => {
		const { owner, sheet } = await exchangeWorld(seriesR('50'));
		const body = (o: object) => ({
			user: owner,
			params: { id: sheet.id },
			method: 'POST',
			body: JSON.stringify(o),
			headers: { 'content-type': 'application/json' }
		});
		const ok = await send(
			touchstone.POST,
			body({ port1: { plus: 'in' }, port2: { plus: 'out' }, frequencies: [1e3], format: 'DB' })
		);
		expect(ok.status, ok.text).toBe(200);
		// 50 Ω in series between 50 Ω ports: S21 = 100/150 → 20·log10(2/3) dB (closed form)
		expect(numbers(dataLines(ok.text)[0])[3]).toBeCloseTo(20 * Math.log10(2 / 3), 8);
		const badField = await send(touchstone.POST, body({ parameter: 'H' }));
		expect(badField.status).toBe(400);
		expect(badField.json.error).toMatch(/^parameter: parameter must be S, Z or Y/);
		const badNode = await send(
			touchstone.POST,
			body({ port1: { plus: 'nowhere' }, port2: { plus: 'out' } })
		);
		expect(badNode.status).toBe(422);
		expect(badNode.json).toMatchObject({ node: 'nowhere' });
	});
});

describe('results CSV', () => {
	it('poles, time constants, response and step of the stored revision; RC pole at −1/RC (closed form)', async () => {
		const { owner, sheet } = await exchangeWorld();
		const poles = await send(results.GET, {
			user: owner,
			params: { id: sheet.id, file: 'poles.csv' }
		});
		expect(poles.status, poles.text).toBe(200);
		expect(poles.headers.get('content-type')).toMatch(/^text\/csv/);
		const rows = poles.text.trim().split('\r\n');
		expect(rows[0].split(',').slice(0, 5)).toEqual([
			'kind',
			'index',
			're_rad_per_s',
			'im_rad_per_s',
			'frequency_hz'
		]);
		const [kind, index, re] = rows[1].split(',');
		expect([kind, index]).toEqual(['pole', '1']);
		expect(rel(Number(re), -1 / (1e3 * 1e-9))).toBeLessThan(1e-9);
		const tc = await send(results.GET, {
			user: owner,
			params: { id: sheet.id, file: 'time-constants.csv' }
		});
		// By column name: the table gained port columns (members, value) after kind.
		const [head, first] = tc.text.trim().split('\r\n').map((line) => line.split(','));
		const col = (name: string) => first[head.indexOf(name)];
		const [el, k, r0, tau0] = ['element', 'kind', 'open_circuit_resistance_ohm', 'open_circuit_tau_s'].map(col);
		expect([el, k, Number(r0)]).toEqual(['C1', 'C', 1000]);
		expect(rel(Number(tau0), 1e-6)).toBeLessThan(1e-9);
		const resp = await send(results.GET, {
			user: owner,
			params: { id: sheet.id, file: 'response.csv' }
		});
		expect(resp.text.split('\r\n')[0]).toBe('frequency_hz,magnitude_db,phase_deg,group_delay_s');
		expect(resp.text.trim().split('\r\n').length).toBe(201);
		const step = await send(results.GET, {
			user: owner,
			params: { id: sheet.id, file: 'step.csv' }
		});
		expect(step.text.split('\r\n')[0]).toBe('time_s,output');
		expect(
			(await send(results.GET, { user: owner, params: { id: sheet.id, file: 'other.csv' } })).status
		).toBe(404);
	});
});
