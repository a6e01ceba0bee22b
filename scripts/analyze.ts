/**
 * `npm run -s analyze -- FILE.json [--table] [--poles N] [--near S] [--full] [--dense|--sparse]`:
 * the solver from a terminal. Large networks (above the interactive size) answer with their N
 * dominant poles (default 10) and every open-circuit time constant; --full adds the responses.
 * stdout carries only the result (JSON, or the table with --table); every message goes to
 * stderr as one line. Exit 2 for input the user can fix (bad file, bad network), 1 for a fault.
 */
import { readFileSync } from 'node:fs';
import { analyze, formatEngineering, SolverError, type Analysis } from '../src/lib/solver/index';
import { INTERACTIVE_ELEMENT_LIMIT } from '../src/lib/network/limits';

function fail(code: number, message: string): never {
	process.stderr.write(message.replace(/\s+/g, ' ').trim() + '\n');
	process.exit(code);
}

const USAGE =
	'usage: analyze FILE.json [--table] [--poles N] [--near RAD_PER_S] [--full] [--dense|--sparse]';
const args = process.argv.slice(2);
const flags = new Set(['--table', '--full', '--dense', '--sparse']);
const valued = new Set(['--poles', '--near']);
const files: string[] = [];
const values = new Map<string, number>();
for (let i = 0; i < args.length; i++) {
	const a = args[i];
	if (valued.has(a)) {
		const v = Number(args[++i]);
		if (args[i] === undefined || !Number.isFinite(v)) fail(2, `${a} needs a number (${USAGE})`);
		if (a === '--poles' && !(Number.isInteger(v) && v >= 1 && v <= 500))
			fail(2, '--poles takes a whole number from 1 to 500');
		if (a === '--near' && v < 0) fail(2, '--near takes a shift ≥ 0 in rad/s');
		values.set(a, v);
	} else if (flags.has(a)) values.set(a, 1);
	else if (a.startsWith('--')) fail(2, `unknown option ${a} (${USAGE})`);
	else files.push(a);
}
if (files.length !== 1) fail(2, USAGE);
const table = values.has('--table');
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

// A large network (the sparse back end) answers with its dominant poles and every open-circuit
// time constant by default, within the time targets of docs/performance.md; --full adds the
// frequency response and the step response.
const count = (doc as { elements?: unknown[] })?.elements?.length ?? 0;
const backend = values.has('--dense') ? 'dense' : values.has('--sparse') ? 'sparse' : 'auto';
const large = backend === 'sparse' || (backend === 'auto' && count > INTERACTIVE_ELEMENT_LIMIT);
const quick = large && !values.has('--full');
let result: Analysis;
try {
	result = analyze(doc, {
		backend,
		dominant: { count: values.get('--poles'), near: values.get('--near') },
		...(quick ? { frequency: false as const, step: false as const } : {})
	});
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
	const set = a.poleSet;
	const head =
		set && set.method !== 'all'
			? `Poles: the ${set.computed} nearest ${set.shift ? `${f(set.shift)} rad/s` : 'the origin (slowest)'} of ${set.total ?? 'an unknown number'} (${set.method})`
			: 'Poles';
	const lines = [a.title ? `${a.title}\n` : '', head];
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
		// The sparse back end does not compute short-circuit readings (a warning says so).
		const s = a.timeConstants.shortCircuit[i];
		lines.push(
			`  ${pad(o.element, 20)}  ${pad(f(o.resistance, 'Ω'), 12)}  ${pad(f(o.tau, 's'), 11)}  ${s ? `${pad(f(s.resistance, 'Ω'), 12)}  ${f(s.tau, 's')}` : '—'}`
		);
	});
	lines.push(
		'',
		'Sequential (dominant first): ' +
			a.timeConstants.sequential.map((s) => `${s.element} ${f(s.tau, 's')}`).join(', ')
	);
	const elmore = a.timeConstants.elmore;
	if (elmore) lines.push('', `Elmore delay to ${elmore.node}: ${f(elmore.delay, 's')}`);
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
