/**
 * `npm run -s analyze -- FILE.json [--table] [--variant NAME | --variants]`: the solver from a
 * terminal. A document with variants analyses as its base network unless one variant is named
 * (`--variant "100:1 · 2 m cable"`) or all are asked for (`--variants`: JSON
 * `{ variants: [{ name, options, analysis, error }] }`, or one table per variant after a
 * side-by-side table of the key figures).
 * Large networks (above the interactive size) answer with their N dominant poles (--poles N,
 * default 10; --near S for the ones nearest a shift S rad/s) and every open-circuit time
 * constant; --full adds the responses; --dense / --sparse force a back end.
 * The options of POST /api/analyze are taken by the same names and checked by the same code
 * (src/lib/server/analysis-request.ts, analysis-omit.ts): --points=N --fMin=HZ --fMax=HZ
 * --stepPoints=N --tEnd=S --response=0 --step=0 --doubletRatio=X
 * --omit=impedanceCurve,groupDelay,expansion --matrixPorts=N (or `--name value`). Given any of
 * them, the network is analysed with exactly the options the API would use, so the JSON equals
 * the API's answer for the same query (docs/api.md).
 * stdout carries only the result (JSON, or the table with --table); every message goes to
 * stderr as one line. Exit 2 for input the user can fix (bad file, bad network, bad option), 1
 * for a fault.
 */
import { readFileSync } from 'node:fs';
import {
	analyze,
	formatEngineering,
	SolverError,
	type Analysis,
	type AnalyzeOptions
} from '../src/lib/solver/index';
import { INTERACTIVE_ELEMENT_LIMIT } from '../src/lib/network/limits';
import {
	findVariant,
	listVariants,
	resolveVariant,
	VariantError,
	type VariantInfo
} from '../src/lib/network/variants';
import { networkDocumentSchema, type NetworkDocument } from '../src/lib/network/schema';
import { readOptions } from '../src/lib/server/analysis-request';
import { readTrim, skipped, trimAnalysis } from '../src/lib/server/analysis-omit';
import { ApiProblem } from '../src/lib/server/api/problem';

function fail(code: number, message: string): never {
	process.stderr.write(message.replace(/\s+/g, ' ').trim() + '\n');
	process.exit(code);
}

const USAGE =
	'usage: analyze FILE.json [--table] [--variant NAME | --variants] [--poles N] [--near RAD_PER_S] [--full] [--dense | --sparse] [API options: --points=N --fMin=HZ --fMax=HZ --stepPoints=N --tEnd=S --response=0 --step=0 --doubletRatio=X --omit=PARTS --matrixPorts=N]';
/** POST /api/analyze's query options, by name. */
const QUERY = [
	'points',
	'fMin',
	'fMax',
	'stepPoints',
	'tEnd',
	'response',
	'step',
	'doubletRatio',
	'omit',
	'matrixPorts'
];
// API options are lifted out first (`--name=value` or `--name value`); the rest is parsed below.
const query = new URLSearchParams();
const args: string[] = [];
{
	const raw = process.argv.slice(2);
	for (let i = 0; i < raw.length; i++) {
		const m = /^--([A-Za-z]+)(?:=(.*))?$/.exec(raw[i]);
		if (!m || !QUERY.includes(m[1])) {
			args.push(raw[i]);
			continue;
		}
		const value = m[2] ?? raw[++i];
		if (value === undefined) fail(2, `--${m[1]} needs a value (${USAGE})`);
		query.set(m[1], value);
	}
}
const queryGiven = [...query.keys()].length > 0;
let apiOptions: AnalyzeOptions = {};
let trim: ReturnType<typeof readTrim>;
try {
	const url = new URL(`http://cli/?${query}`);
	trim = readTrim(url);
	if (queryGiven) apiOptions = { ...readOptions(url), ...skipped(trim) };
} catch (e) {
	if (e instanceof ApiProblem) fail(2, e.message);
	throw e;
}
const table = args.includes('--table');
const allVariants = args.includes('--variants');
const variantAt = args.indexOf('--variant');
const variantName = variantAt >= 0 ? args[variantAt + 1] : undefined;
if (variantAt >= 0 && (variantName === undefined || variantName.startsWith('--')))
	fail(2, `--variant needs the variant's name (${USAGE})`);
if (variantAt >= 0 && allVariants) fail(2, `name one variant or ask for all, not both (${USAGE})`);
// Options that take a number: --poles N (how many dominant poles), --near S (nearest which shift).
const numbers = new Map<string, number>();
const valueAt = new Set<number>(variantAt >= 0 ? [variantAt + 1] : []);
for (const name of ['--poles', '--near']) {
	const at = args.indexOf(name);
	if (at < 0) continue;
	const v = Number(args[at + 1]);
	if (args[at + 1] === undefined || !Number.isFinite(v))
		fail(2, `${name} needs a number (${USAGE})`);
	if (name === '--poles' && !(Number.isInteger(v) && v >= 1 && v <= 500))
		fail(2, '--poles takes a whole number from 1 to 500');
	if (name === '--near' && v < 0) fail(2, '--near takes a shift ≥ 0 in rad/s');
	numbers.set(name, v);
	valueAt.add(at + 1);
}
const positional = args.filter((a, i) => !a.startsWith('--') && !valueAt.has(i));
const files = positional;
const known = [
	'--table',
	'--variant',
	'--variants',
	'--poles',
	'--near',
	'--full',
	'--dense',
	'--sparse'
];
const unknown = args.filter((a, i) => a.startsWith('--') && !valueAt.has(i) && !known.includes(a));
if (unknown.length) fail(2, `unknown option ${unknown[0]} (${USAGE})`);
if (files.length !== 1) fail(2, USAGE);
if (args.includes('--dense') && args.includes('--sparse'))
	fail(2, `--dense or --sparse, not both (${USAGE})`);

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

/**
 * A large network (above the interactive size, or --sparse) answers with its dominant poles and
 * every open-circuit time constant by default, within the time targets of docs/performance.md;
 * --full adds the frequency response and the step response.
 */
function optionsFor(d: unknown): AnalyzeOptions {
	const count = (d as { elements?: unknown[] })?.elements?.length ?? 0;
	const backend = args.includes('--dense')
		? 'dense'
		: args.includes('--sparse')
			? 'sparse'
			: 'auto';
	const large = backend === 'sparse' || (backend === 'auto' && count > INTERACTIVE_ELEMENT_LIMIT);
	return {
		backend,
		dominant: { count: numbers.get('--poles'), near: numbers.get('--near') },
		// With the API's options given, they decide what is computed, as in the API.
		...(large && !args.includes('--full') && !queryGiven
			? { frequency: false as const, step: false as const }
			: {}),
		...apiOptions
	};
}

function analyzeOrFail(d: unknown, where: string): Analysis {
	try {
		return trimAnalysis(analyze(d, optionsFor(d)), trim);
	} catch (e) {
		if (e instanceof SolverError) fail(2, `${where}: ${e.message}`);
		fail(1, `internal error: ${(e as Error)?.stack?.split('\n')[0] ?? String(e)}`);
	}
}

if (variantName !== undefined || allVariants) {
	// The base document is checked whole first, so a broken variant block is named up front.
	analyzeOrFail(doc, files[0]);
	const parsed = networkDocumentSchema.parse(doc);
	let chosen: VariantInfo[];
	try {
		chosen = allVariants ? listVariants(parsed) : [findVariant(parsed, variantName!)];
	} catch (e) {
		if (e instanceof VariantError) fail(2, `${files[0]}: ${e.message}`);
		throw e;
	}
	if (allVariants && chosen.length === 0) fail(2, `${files[0]}: the network has no variants`);
	const outcomes = chosen.map((v) => outcomeOf(parsed, v));
	if (!allVariants) {
		const [o] = outcomes;
		if (!o.analysis) fail(2, `${files[0]}: variant "${o.name}": ${o.error!.error}`);
		process.stdout.write(table ? renderTable(o.analysis) : JSON.stringify(o.analysis) + '\n');
	} else if (!table) {
		process.stdout.write(JSON.stringify({ variants: outcomes }) + '\n');
	} else {
		process.stdout.write(renderSideBySide(outcomes));
		for (const o of outcomes)
			process.stdout.write(
				`\n=== ${o.name} ===\n` +
					(o.analysis ? renderTable(o.analysis) : `refused: ${o.error!.error}\n`)
			);
	}
	process.exit(0);
}

const result = analyzeOrFail(doc, files[0]);
if (!table) {
	process.stdout.write(JSON.stringify(result) + '\n');
} else {
	process.stdout.write(renderTable(result));
}

interface Outcome {
	name: string;
	options: string[];
	analysis: Analysis | null;
	error: { error: string; code: string; element?: string; node?: string } | null;
}

/** One variant's analysis; a variant the solver refuses keeps its error, the others go on. */
function outcomeOf(parsed: NetworkDocument, v: VariantInfo): Outcome {
	try {
		return {
			name: v.name,
			options: v.options,
			analysis: trimAnalysis(analyze(resolveVariant(parsed, v), optionsFor(parsed)), trim),
			error: null
		};
	} catch (e) {
		if (e instanceof SolverError || e instanceof VariantError) {
			const error =
				e instanceof SolverError ? e.toJSON() : { error: e.message, code: e.code, ...e.where };
			return { name: v.name, options: v.options, analysis: null, error };
		}
		throw e;
	}
}

function renderSideBySide(outcomes: Outcome[]): string {
	const f = (v: number | null | undefined, unit = '') =>
		v === null || v === undefined ? '—' : formatEngineering(v, unit, 4);
	const rows: string[][] = [
		['variant', 'DC gain', 'bandwidth', 'rise', 'overshoot', 'settling', 'Zin DC', 'pole 1']
	];
	for (const o of outcomes) {
		const a = o.analysis;
		if (!a) {
			rows.push([o.name, `refused: ${o.error!.error}`]);
			continue;
		}
		rows.push([
			o.name,
			a.dcGain === null ? '—' : a.dcGain.toPrecision(6),
			f(a.bandwidth, 'Hz'),
			f(a.step?.riseTime, 's'),
			a.step?.overshoot == null ? '—' : `${a.step.overshoot.toFixed(2)} %`,
			f(a.step?.settlingTime, 's'),
			a.inputImpedance?.dc ? f(a.inputImpedance.dc.re, 'Ω') : '∞',
			a.poles[0] ? f(a.poles[0].hz, 'Hz') : '—'
		]);
	}
	const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => [...(r[c] ?? '')].length)) + 2);
	const pad = (s: string, n: number) => s + ' '.repeat(Math.max(0, n - [...s].length));
	return (
		[
			'Variants side by side',
			...rows.map((r) => '  ' + r.map((c, i) => pad(c, widths[i])).join(''))
		].join('\n') + '\n'
	);
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
			p.owners[0] ? `${p.owners[0].element} ${Number((p.owners[0].share * 100).toPrecision(2))} %` : '—'
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
	// How each resistance seen is made up (the series–parallel formula, or why there is none).
	const formula = (t: (typeof a.timeConstants.openCircuit)[number], config: string) => {
		const r = t.formula;
		const why = r.kind === 'series-parallel' ? `${r.formula} = ${f(r.value, 'Ω')}` : `${r.reason}`;
		return `  ${pad(t.element, 20)}  ${config}: ${why}`;
	};
	lines.push('', 'Resistance seen, how it is made up');
	for (const t of a.timeConstants.openCircuit) lines.push(formula(t, 'others open   '));
	for (const t of a.timeConstants.shortCircuit) lines.push(formula(t, 'others shorted'));
	const doublets = a.doublets ?? [];
	for (const d of doublets) {
		const c = d.closing[0];
		lines.push(
			'',
			`Doublet p${d.pole + 1}/z${d.zero + 1}: (z − p)/p = ${(d.separation * 100).toPrecision(3)} %` +
				(d.tail === null
					? ''
					: `, tail ${(d.tail * 100).toPrecision(3)} % with τ ${f(d.tailTau, 's')}`) +
				(c ? `; closes with ${c.element} → ${f(c.to)} (${(c.change * 100).toPrecision(3)} %)` : '')
		);
	}
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
