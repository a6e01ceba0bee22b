/**
 * `npm run -s analyze -- FILE.json [--table]`: the solver from a terminal.
 * stdout carries only the result (JSON, or the table with --table); every message goes to
 * stderr as one line. Exit 2 for input the user can fix (bad file, bad network), 1 for a fault.
 */
import { readFileSync } from 'node:fs';
import { analyze, formatEngineering, SolverError, type Analysis } from '../src/lib/solver/index';

function fail(code: number, message: string): never {
	process.stderr.write(message.replace(/\s+/g, ' ').trim() + '\n');
	process.exit(code);
}

const args = process.argv.slice(2);
const table = args.includes('--table');
const files = args.filter((a) => !a.startsWith('--'));
const unknown = args.filter((a) => a.startsWith('--') && a !== '--table');
if (unknown.length) fail(2, `unknown option ${unknown[0]} (usage: analyze FILE.json [--table])`);
if (files.length !== 1) fail(2, 'usage: analyze FILE.json [--table]');

let text: string;
try {
	text = readFileSync(files[0], 'utf8');
} catch (e) {
	fail(2, `cannot read ${files[0]}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
}
let doc: unknown;
try {
	doc = JSON.parse(text);
} catch (e) {
	fail(2, `${files[0]} is not valid JSON: ${(e as Error).message}`);
}

let result: Analysis;
try {
	result = analyze(doc);
} catch (e) {
	if (e instanceof SolverError) fail(2, `${files[0]}: ${e.message}`);
	fail(1, `internal error: ${(e as Error)?.stack?.split('\n')[0] ?? String(e)}`);
}

if (!table) {
	process.stdout.write(JSON.stringify(result) + '\n');
} else {
	process.stdout.write(renderTable(result));
}

function renderTable(a: Analysis): string {
	const f = (v: number | null | undefined, unit = '', digits = 4) =>
		v === null || v === undefined ? '∞' : formatEngineering(v, unit, digits);
	const pad = (s: string, n: number) => s + ' '.repeat(Math.max(0, n - [...s].length));
	const rows: string[][] = [['#', 'pole (rad/s)', 'f', 'Q', 'τ', 'estimate', 'error', 'owner']];
	a.poles.forEach((p, i) => {
		const im = p.im === 0 ? '' : ` ${p.im < 0 ? '−' : '+'} j${f(Math.abs(p.im))}`;
		rows.push([
			String(i + 1),
			f(p.re) + im,
			f(p.hz, 'Hz'),
			p.q === null ? (p.im === 0 ? 'real' : '—') : p.q.toPrecision(4),
			f(p.tau, 's'),
			p.estimate ? `${f(p.estimate.hz, 'Hz')} (${p.estimate.basis})` : '—',
			p.relativeError === null ? '—' : `${(p.relativeError * 100).toPrecision(3)} %`,
			p.owners[0] ? `${p.owners[0].element} ${(p.owners[0].share * 100).toFixed(0)} %` : '—'
		]);
	});
	const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => [...r[c]].length)) + 2);
	const lines = [a.title ? `${a.title}\n` : '', 'Poles'];
	for (const r of rows) lines.push('  ' + r.map((c, i) => pad(c, widths[i])).join(''));
	if (a.zeros.length) {
		lines.push('', 'Zeros');
		for (const z of a.zeros)
			lines.push(
				`  ${f(z.re)}${z.im ? ` ${z.im < 0 ? '−' : '+'} j${f(Math.abs(z.im))}` : ''}  (${f(z.hz, 'Hz')})${z.cancels !== null ? `  ≈ pole ${z.cancels + 1}` : ''}`
			);
	}
	lines.push('', 'Time constants          R (open)      τ open       R (short)     τ short');
	a.timeConstants.openCircuit.forEach((o, i) => {
		const s = a.timeConstants.shortCircuit[i];
		lines.push(
			`  ${pad(o.element, 20)}  ${pad(f(o.resistance, 'Ω'), 12)}  ${pad(f(o.tau, 's'), 11)}  ${pad(f(s.resistance, 'Ω'), 12)}  ${f(s.tau, 's')}`
		);
	});
	lines.push(
		'',
		'Sequential (dominant first): ' +
			a.timeConstants.sequential.map((s) => `${s.element} ${f(s.tau, 's')}`).join(', ')
	);
	lines.push(
		'',
		`DC gain         ${a.dcGain === null ? '∞ (pole at 0)' : a.dcGain.toPrecision(6)}`
	);
	lines.push(`Bandwidth       ${a.bandwidth === null ? '—' : f(a.bandwidth, 'Hz')}`);
	lines.push(`Rise time       ${a.step?.riseTime == null ? '—' : f(a.step.riseTime, 's')}`);
	lines.push(
		`Overshoot       ${a.step?.overshoot == null ? '—' : a.step.overshoot.toFixed(2) + ' %'}`
	);
	lines.push(`Settling (1 %)  ${a.step?.settlingTime == null ? '—' : f(a.step.settlingTime, 's')}`);
	lines.push(`Input Z at DC   ${a.inputImpedance?.dc ? f(a.inputImpedance.dc.re, 'Ω') : '∞'}`);
	for (const w of a.warnings) lines.push(`warning: ${w.message}`);
	return lines.join('\n') + '\n';
}
