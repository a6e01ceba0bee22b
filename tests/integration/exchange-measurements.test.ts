// Measured-response uploads through the route: a set of CSV files made here, each variation
// named, parse to the expected curve or fail naming the exact row (the file's line number) and
// column. Oversize and disguised uploads are refused with 413/415 and nothing is stored.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { exchangeWorld, fileForm, send } from './exchange-helpers';
import * as list from '../../src/routes/api/sheets/[id=uuid]/measurements/+server';
import * as one from '../../src/routes/api/sheets/[id=uuid]/measurements/[measurementId=uuid]/+server';
import * as file from '../../src/routes/api/sheets/[id=uuid]/measurements/[measurementId=uuid]/file/+server';
import { countMeasurements } from '../../src/lib/server/db/measurements';

useDatabase();

// Expected curve of every good file: 1 kHz, 10 kHz, 100 kHz at 0, −3, −20 dB; phase 0, −45, −84.
const F = [1e3, 1e4, 1e5];
const DB = [0, -3, -20];
const PH = [0, -45, -84];
const lin = DB.map((d) => 10 ** (d / 20));

const good: [string, string, { phase: boolean }][] = [
	[
		'comma, header in Hz, dB and phase',
		'Frequency (Hz),Magnitude (dB),Phase (deg)\n1000,0,0\n10000,-3,-45\n100000,-20,-84\n',
		{ phase: true }
	],
	[
		'semicolon with decimal comma, kHz header',
		'Frequenz (kHz);Gain (dB);Phase (deg)\n1,0;0,0;0,0\n10,0;-3,0;-45,0\n100,0;-20,0;-84,0\n',
		{ phase: true }
	],
	[
		'tab separated, MHz header, no phase',
		'f [MHz]\tS21 [dB]\n0.001\t0\n0.01\t-3\n0.1\t-20\n',
		{ phase: false }
	],
	['no header: frequency, dB, phase', '1000,0,0\n10000,-3,-45\n100000,-20,-84\n', { phase: true }],
	[
		'linear magnitude named in the header',
		`freq/Hz,|H| (V/V)\n1000,${lin[0]}\n10000,${lin[1]}\n100000,${lin[2]}\n`,
		{ phase: false }
	],
	[
		'CRLF line ends, a BOM, comment lines and blank lines',
		'\uFEFF! exported by bench analyzer\r\n# sweep 1\r\nfrequency_hz,magnitude_db,phase_deg\r\n\r\n1000,0,0\r\n10000,-3,-45\r\n100000,-20,-84\r\n',
		{ phase: true }
	],
	[
		'falling sweep (sorted on the way in)',
		'Frequency (Hz),Magnitude (dB),Phase (deg)\n100000,-20,-84\n10000,-3,-45\n1000,0,0\n',
		{ phase: true }
	],
	[
		'GHz header, scientific notation',
		'Frequency (GHz),Gain (dB)\n1e-6,0\n1E-5,-3.0\n1.0e-4,-2.0e1\n',
		{ phase: false }
	]
];

const bad: [string, string, { row: number | null; column: number | null; message: RegExp }][] = [
	[
		'a word in a magnitude cell',
		'Frequency (Hz),Magnitude (dB)\n1000,0\n10000,abc\n100000,-20\n',
		{ row: 3, column: 2, message: /^row 3, column 2 \(magnitude\): "abc" is not a number$/ }
	],
	[
		'a missing cell (short row)',
		'f,dB\n1000,0\n10000\n',
		{
			row: 3,
			column: 2,
			message: /^row 3, column 2 \(magnitude\): the cell is empty \(the row has 1 column\)$/
		}
	],
	[
		'a zero frequency',
		'f (Hz),mag (dB)\n0,0\n10,-1\n',
		{
			row: 2,
			column: 1,
			message: /^row 2, column 1 \(frequency\): the frequency must be greater than 0$/
		}
	],
	[
		'a repeated frequency',
		'f (Hz),mag (dB)\n1,0\n2,-1\n2,-2\n',
		{ row: 4, column: 1, message: /^row 4, column 1 \(frequency\): 2 Hz repeats row 3$/ }
	],
	[
		'a sweep that turns back',
		'f (Hz),mag (dB)\n1,0\n3,-1\n2,-2\n',
		{ row: 4, column: 1, message: /sweep turns back/ }
	],
	[
		'a decimal point in a decimal-comma file',
		'f;dB\n1,5;0,1\n2.5;0,2\n',
		{
			row: 3,
			column: 1,
			message:
				/^row 3, column 1 \(frequency\): "2.5" is not a number \(this file uses a decimal comma\)$/
		}
	],
	[
		'a negative linear magnitude',
		'f (Hz),|H| (V/V)\n1,0.5\n2,-0.1\n',
		{ row: 3, column: 2, message: /linear magnitude must be greater than 0/ }
	],
	[
		'a bad phase cell after comments (rows count every line)',
		'# note\n! note\nf (Hz),dB,Phase (deg)\n1,0,0\n\n2,-1,x\n',
		{ row: 6, column: 3, message: /^row 6, column 3 \(phase\): "x" is not a number$/ }
	],
	['an empty file', '   \n', { row: null, column: null, message: /^the file is empty$/ }],
	[
		'a header only',
		'Frequency (Hz),Magnitude (dB)\n',
		{ row: null, column: null, message: /at least 2 are needed/ }
	]
];

describe('measured-response CSV upload', () => {
	it.each(good)('reads %s', async (name, csv, { phase }) => {
		const { owner, sheet } = await exchangeWorld();
		const r = await send(list.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm(csv, 'bench.csv', { name })
		});
		expect(r.status, r.text).toBe(201);
		const m = r.json.measurement;
		expect(m.name).toBe(name);
		expect(m.points).toBe(3);
		m.curve.f.forEach((f: number, i: number) => expect(Math.abs(f / F[i] - 1)).toBeLessThan(1e-12));
		m.curve.magnitudeDb.forEach((d: number, i: number) => expect(d).toBeCloseTo(DB[i], 9));
		if (phase) expect(m.curve.phaseDeg).toEqual(PH);
		else expect(m.curve.phaseDeg).toBeNull();
	});

	it.each(bad)('refuses %s, naming the row and column', async (_name, csv, want) => {
		const { owner, sheet } = await exchangeWorld();
		const r = await send(list.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm(csv, 'bench.csv')
		});
		expect(r.status, r.text).toBe(422);
		expect(r.json).toMatchObject({ code: 'bad_csv', row: want.row, column: want.column });
		expect(r.json.error).toMatch(want.message);
		expect(await countMeasurements(sheet.id)).toBe(0);
	});

	it('uses the columns the person confirmed over the guess (phase first, magnitude linear)', async () => {
		const { owner, sheet } = await exchangeWorld();
		const columns = JSON.stringify({
			frequency: 1,
			frequencyUnit: 'kHz',
			magnitude: 2,
			magnitudeKind: 'linear',
			phase: 0,
			phaseUnit: 'deg'
		});
		const r = await send(list.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm('-10,1,1\n-20,2,0.1\n', 'x.csv', { columns })
		});
		expect(r.status, r.text).toBe(201);
		expect(r.json.measurement.curve).toEqual({
			f: [1000, 2000],
			magnitudeDb: [0, -20],
			phaseDeg: [-10, -20]
		});
	});

	it('lists, renames, serves the original file and deletes; readers only read', async () => {
		const { owner, outsider, sheet } = await exchangeWorld();
		const csv = 'Frequency (Hz),Magnitude (dB)\n10,0\n20,-1\n';
		const made = (
			await send(list.POST, {
				user: owner,
				params: { id: sheet.id },
				form: fileForm(csv, 'sweep 1.csv')
			})
		).json.measurement;
		expect(made.name).toBe('sweep 1');
		const params = { id: sheet.id, measurementId: made.id };
		const listed = await send(list.GET, { user: owner, params: { id: sheet.id } });
		expect(listed.json.measurements.map((m: { name: string }) => m.name)).toEqual(['sweep 1']);
		expect(listed.json.measurements[0].curve).toBeUndefined();
		const renamed = await send(one.PATCH, {
			user: owner,
			params,
			method: 'PATCH',
			body: JSON.stringify({ name: 'Probe tip, 1 m cable' }),
			headers: { 'content-type': 'application/json' }
		});
		expect(renamed.json.measurement.name).toBe('Probe tip, 1 m cable');
		const original = await send(file.GET, { user: owner, params });
		expect(original.text).toBe(csv);
		expect(original.headers.get('content-disposition')).toMatch(
			/^attachment; filename="sweep 1.csv"/
		);
		// Someone from another workspace sees nothing (404, not 403).
		expect((await send(one.GET, { user: outsider, params })).status).toBe(404);
		expect(
			(
				await send(list.POST, {
					user: outsider,
					params: { id: sheet.id },
					form: fileForm(csv, 'x.csv')
				})
			).status
		).toBe(404);
		expect((await send(one.DELETE, { user: owner, params, method: 'DELETE' })).status).toBe(204);
		expect(await countMeasurements(sheet.id)).toBe(0);
	});

	it('413 for a file over the limit and 415 for an image named .csv; nothing stored', async () => {
		const { owner, sheet } = await exchangeWorld();
		const big = 'f,dB\n' + '1000,0\n'.repeat(800_000); // about 5.6 MB, over the 5 MB default
		const over = await send(list.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm(big, 'big.csv')
		});
		expect(over.status).toBe(413);
		expect(over.json.error).toMatch(/over the 5 MB upload limit/);
		const png = Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex');
		const disguised = await send(list.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm(png, 'sweep.csv')
		});
		expect(disguised.status).toBe(415);
		expect(disguised.json.error).toMatch(/not a CSV text file \(its content is image\/png\)/);
		expect(await countMeasurements(sheet.id)).toBe(0);
	});
});
