/**
 * `npm run bench`: median time of a full analysis (poles, zeros, all time constants, a 200-point
 * response and step) on generated RC ladders and random RC meshes with 10…1000 capacitors, a
 * 1000-point sweep, and the growth exponent between sizes. Prints a table; writes
 * bench-results/solver.json. Repeats shrink with size so the whole run stays near 3 minutes.
 * Each row gives the wall-clock median, the fastest run and the median process CPU time: on a
 * shared machine the wall clock also counts the time other jobs held the cores.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { analyze, frequencyResponseAt, validateNetwork } from '../src/lib/solver/index';
import { assemble } from '../src/lib/solver/assemble';
import { directSystem } from '../src/lib/solver/direct-solve';
import { sweep as directSweep } from '../src/lib/solver/direct-response';
import { logSpace } from '../src/lib/solver/frequency-response';
import {
	denseLadder as ladder,
	denseMesh as mesh,
	type DenseDoc as Doc
} from './lib/dense-networks';
import { spawnSync } from 'node:child_process';

function median(xs: number[]): number {
	const s = xs.slice().sort((a, b) => a - b);
	return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}

function time(fn: () => void, reps: number): number[] {
	return timeBoth(fn, reps).wall;
}

/** Wall time and process CPU time per run. On a shared, overloaded machine the wall clock also
 *  counts the time other jobs held the cores; CPU time (and the fastest run) show the cost. */
function timeBoth(fn: () => void, reps: number): { wall: number[]; cpu: number[] } {
	const wall: number[] = [];
	const cpu: number[] = [];
	for (let i = 0; i < reps; i++) {
		const c = process.cpuUsage();
		const t = performance.now();
		fn();
		wall.push(performance.now() - t);
		const u = process.cpuUsage(c);
		cpu.push((u.user + u.system) / 1000);
	}
	return { wall, cpu };
}

/**
 * Machine calibration: a fixed 200×200 dense LU-like kernel (≈5.3 Mflop). Shared CI machines vary
 * by an order of magnitude; dividing by this figure makes runs comparable.
 */
function calibrate(): { wall: number; cpu: number } {
	const n = 200;
	const a = new Float64Array(n * n).map(
		(_, i) => 1 + ((i * 7) % 13) / 13 + (i % (n + 1) === 0 ? n : 0)
	);
	const runs = timeBoth(() => {
		const b = a.slice();
		for (let k = 0; k < n; k++)
			for (let i = k + 1; i < n; i++) {
				const f = b[i * n + k] / b[k * n + k];
				for (let j = k + 1; j < n; j++) b[i * n + j] -= f * b[k * n + j];
			}
	}, 15);
	return { wall: median(runs.wall), cpu: median(runs.cpu) };
}

const SIZES = [10, 30, 50, 100, 300, 1000];
const reps = (n: number) => (n <= 50 ? 201 : n <= 100 ? 31 : n <= 300 ? 5 : 1);
/** Warm-up runs: the analysis runs in a long-lived worker, so the figure of interest is the
 *  optimized code's, not the first calls' while the JIT is still compiling. */
const warmups = (n: number) => (n <= 100 ? 20 : n <= 300 ? 1 : 0);
/** The whole run should stay near three minutes; a size whose projected time would blow the
 *  budget is reported as skipped with its projection rather than silently left out. */
const BUDGET_MS = 150_000;
const began = performance.now();
const loadBefore = loadavg()[0];
const calibration = calibrate();
const calibrationMs = calibration.wall;
process.stderr.write(
	`calibration (200×200 elimination): ${calibrationMs.toFixed(1)} ms (cpu ${calibration.cpu.toFixed(1)} ms); load average ${loadBefore.toFixed(1)}\n`
);
const rows: {
	family: string;
	n: number;
	medianMs: number | null;
	fastestMs: number | null;
	cpuMs: number | null;
	runs: number;
	poles: number;
	exponent: number | null;
	note: string;
}[] = [];

for (const [family, make] of [
	['ladder', ladder],
	['mesh', mesh]
] as const) {
	let prev: { n: number; ms: number; k: number } | null = null;
	for (const n of SIZES) {
		const doc = make(n);
		const spent = performance.now() - began;
		// Project with the growth seen so far (at least quadratic, at most cubic).
		const k = Math.min(3, Math.max(2, prev?.k ?? 3));
		const projected = prev ? prev.ms * (n / prev.n) ** k : 0;
		if (prev && spent + projected * (family === 'ladder' ? 2.2 : 1.1) > BUDGET_MS) {
			rows.push({
				family,
				n,
				medianMs: null,
				fastestMs: null,
				cpuMs: null,
				runs: 0,
				poles: 0,
				exponent: null,
				note: `skipped: projected ${(projected / 1000).toFixed(0)} s (n^${k.toFixed(1)}) exceeds the run budget`
			});
			process.stderr.write(
				`${family} ${n}: skipped (projected ${(projected / 1000).toFixed(0)} s)\n`
			);
			continue;
		}
		const r = reps(n);
		for (let w = 0; w < warmups(n); w++) analyze(doc);
		let poles = 0;
		const runs = timeBoth(() => (poles = analyze(doc).poles.length), r);
		const ms = median(runs.wall);
		const cpuMs = median(runs.cpu);
		const exponent: number | null = prev ? Math.log(ms / prev.ms) / Math.log(n / prev.n) : null;
		rows.push({
			family,
			n,
			medianMs: ms,
			fastestMs: Math.min(...runs.wall),
			cpuMs,
			runs: r,
			poles,
			exponent,
			note: ''
		});
		prev = { n, ms, k: exponent ?? 3 };
		process.stderr.write(`${family} ${n}: ${ms.toFixed(1)} ms (cpu ${cpuMs.toFixed(1)} ms)\n`);
	}
}

// 1000-point sweep: inside analyze (banded direct solve with its derivative, issue 12) and by the
// dense direct complex solves of frequencyResponseAt.
const sweep: { n: number; analyzeMs: number; directMs: number | null; note: string }[] = [];
for (const n of [10, 30, 100, 300]) {
	if (performance.now() - began > BUDGET_MS + 20_000 && n > 30) {
		sweep.push({ n, analyzeMs: NaN, directMs: null, note: 'skipped: run budget spent' });
		continue;
	}
	const doc = ladder(n);
	const a = median(
		time(() => analyze(doc, { frequency: { points: 1000 }, step: false }), n <= 100 ? 5 : 1)
	);
	const freqs = Array.from({ length: 1000 }, (_, i) => 10 ** (2 + (6 * i) / 999));
	const direct = n <= 100 ? median(time(() => frequencyResponseAt(doc, freqs), 1)) : null;
	sweep.push({
		n,
		analyzeMs: a,
		directMs: direct,
		note: direct === null ? 'direct O(N³) per point not run above 100 nodes' : ''
	});
	process.stderr.write(`sweep ${n}: ${a.toFixed(1)} ms / ${direct?.toFixed(1) ?? '—'} ms\n`);
}

const pad = (s: string, w: number) => s.padStart(w);
console.log('\nFull analysis (median)');
console.log(
	`${'family'.padEnd(8)}${pad('n', 6)}${pad('median ms', 12)}${pad('fastest', 10)}${pad('cpu ms', 10)}${pad('runs', 6)}${pad('poles', 7)}${pad('growth', 8)}`
);
const fmt = (x: number | null) => (x === null ? '—' : x.toFixed(2));
for (const r of rows) {
	console.log(
		`${r.family.padEnd(8)}${pad(String(r.n), 6)}${pad(fmt(r.medianMs), 12)}${pad(fmt(r.fastestMs), 10)}${pad(fmt(r.cpuMs), 10)}${pad(String(r.runs), 6)}${pad(String(r.poles), 7)}${pad(r.exponent === null ? '—' : r.exponent.toFixed(2), 8)}  ${r.note}`
	);
}
console.log('\n1000-point frequency sweep (RC ladder)');
console.log(`${pad('n', 6)}${pad('in analyze ms', 15)}${pad('direct ms', 12)}`);
for (const s of sweep)
	console.log(
		`${pad(String(s.n), 6)}${pad(s.analyzeMs.toFixed(1), 15)}${pad(s.directMs === null ? '—' : s.directMs.toFixed(1), 12)}  ${s.note}`
	);
/**
 * The first target is worded per element ("a 50-element network"), the second per capacitor;
 * the family rows above count capacitors (ladder 50 has 101 elements). So the first target is
 * timed on networks of exactly 50 elements: a 24-section ladder with its source and a load
 * resistor, and the largest mesh of the family with at most 50 elements (padded with resistors
 * to ground up to 50). The 50-capacitor rows stay in the table as the stricter reading.
 */
function exactly50(): { name: string; doc: Doc }[] {
	const lad = ladder(24);
	lad.elements.push({ id: 'Rload', type: 'R', nodes: ['x24', 'gnd'], value: 1e4 });
	let n = 10;
	while (mesh(n + 1).elements.length <= 50) n++;
	const m = mesh(n);
	for (let k = 0; m.elements.length < 50; k++)
		m.elements.push({ id: `Rpad${k}`, type: 'R', nodes: [`m${k}`, 'gnd'], value: 1e5 });
	return [
		{ name: `ladder, 24 capacitors`, doc: lad },
		{ name: `mesh, ${m.elements.filter((e) => e.type === 'C').length} capacitors`, doc: m }
	];
}
const fifty = exactly50().map(({ name, doc }) => {
	for (let w = 0; w < 20; w++) analyze(doc);
	const runs = timeBoth(() => analyze(doc), 201);
	return {
		name,
		elements: doc.elements.length,
		medianMs: median(runs.wall),
		fastestMs: Math.min(...runs.wall),
		cpuMs: median(runs.cpu)
	};
});
console.log('\nExactly 50 elements (201 runs after 20 warm-up runs)');
for (const f of fifty)
	console.log(
		`${f.name.padEnd(24)}${pad(String(f.elements), 4)} elements${pad(fmt(f.medianMs), 10)} ms median${pad(fmt(f.fastestMs), 8)} fastest${pad(fmt(f.cpuMs), 8)} cpu`
	);
/**
 * The responses come from the network equations (per point a banded complex LU of G + jωC, or for
 * a wide band one O(N²) solve of the Hessenberg form reduced once at the analysis' shift, and one
 * more solve for the group delay): a 200-point response of the 300-capacitor networks, ordering
 * and reduction included, against the target of 50 ms. The shift is the analysis' own choice,
 * the geometric middle of the poles (shift.ts), read once outside the timing.
 */
const response300 = (['ladder', 'mesh'] as const).map((family) => {
	const doc = family === 'ladder' ? ladder(300) : mesh(300);
	const net = validateNetwork(doc);
	const f = logSpace(1, 1e9, 200);
	const mags = analyze(doc, { frequency: false, step: false }).poles.map((p) =>
		Math.hypot(p.re, p.im)
	);
	const s0 = Math.sqrt(Math.min(...mags) * Math.max(...mags));
	const run = () =>
		directSweep(
			directSystem(
				assemble(net, () => 'pencil'),
				s0
			),
			f,
			true,
			true
		);
	run();
	const runs = timeBoth(run, 7);
	return { family, medianMs: median(runs.wall), cpuMs: median(runs.cpu) };
});
console.log('\n200-point response from the network equations, 300 capacitors (7 runs)');
for (const r of response300)
	console.log(
		`${r.family.padEnd(8)}${pad(fmt(r.medianMs), 10)} ms median${pad(fmt(r.cpuMs), 8)} cpu`
	);
/**
 * Issue 15's dense target: the full analysis of the 300-capacitor mesh within 2× of the generic
 * dense route (scripts/lib/generic-dense-route.ts: ml-matrix LU and nonsymmetric eigenvalues,
 * one solve per capacitor), timed in this run. The route runs in a child process of its own
 * (scripts/generic-route-timing.ts): loading ml-matrix into this process slowed the analysis by
 * about 30 % (docs/performance.md). Three rounds, each: our analysis 9 times, then the route 9
 * times in its child; 15 warm-ups of each before every block (the analysis runs in a long-lived
 * worker: the optimized code's figure is the one that matters; before V8 has compiled it,
 * process CPU also counts the compiler's threads). Medians over the rounds, wall and CPU both
 * kept and both held to the target. The route's poles are compared with ours so the yardstick
 * is known to compute the same thing.
 */
const versus = (() => {
	const doc = mesh(300);
	const ours = analyze(doc);
	for (let w = 0; w < 15; w++) analyze(doc);
	const full = { wall: [] as number[], cpu: [] as number[] };
	const route = { wall: [] as number[], cpu: [] as number[] };
	let routePoles: number[] = [];
	for (let round = 0; round < 3; round++) {
		const f = timeBoth(() => analyze(doc), 9);
		full.wall.push(median(f.wall));
		full.cpu.push(median(f.cpu));
		const child = spawnSync(
			process.execPath,
			['--import', 'tsx', 'scripts/generic-route-timing.ts', '9', '15'],
			{ encoding: 'utf8', maxBuffer: 1 << 24 }
		);
		if (child.status !== 0) throw new Error(`generic route: ${child.stderr}`);
		const g = JSON.parse(child.stdout.trim().split('\n').pop()!);
		route.wall.push(g.wallMs);
		route.cpu.push(g.cpuMs);
		routePoles = g.poles;
	}
	const key = (p: { re: number; im: number }) => Math.hypot(p.re, p.im);
	const a = ours.poles.map(key).sort((x, y) => x - y);
	const b = routePoles.slice().sort((x, y) => x - y);
	const worst =
		a.length === b.length ? Math.max(...a.map((x, i) => Math.abs(x - b[i]) / x)) : Infinity;
	return {
		fullCpuMs: median(full.cpu),
		routeCpuMs: median(route.cpu),
		fullWallMs: median(full.wall),
		routeWallMs: median(route.wall),
		ratio: median(full.cpu) / median(route.cpu),
		wallRatio: median(full.wall) / median(route.wall),
		poles: [a.length, b.length],
		worstPoleDeviation: worst
	};
})();
console.log(
	`\n300-capacitor mesh: full analysis ${fmt(versus.fullCpuMs)} ms CPU / ${fmt(versus.fullWallMs)} ms wall, generic dense route (ml-matrix) ${fmt(versus.routeCpuMs)} / ${fmt(versus.routeWallMs)} ms, ratio ${versus.ratio.toFixed(2)} CPU / ${versus.wallRatio.toFixed(2)} wall (target ≤ 2: ${Math.max(versus.ratio, versus.wallRatio) <= 2 ? 'met' : 'MISSED'}); ${versus.poles[0]} / ${versus.poles[1]} poles, largest relative difference ${versus.worstPoleDeviation.toExponential(1)}`
);
const tResp = Math.max(...response300.map((r) => r.medianMs));
const t50 = Math.max(...fifty.map((f) => f.medianMs));
const t50caps = rows.find((r) => r.family === 'ladder' && r.n === 50)!.medianMs ?? NaN;
const t300 = Math.max(...rows.filter((r) => r.n === 300).map((r) => r.medianMs ?? Infinity));
const loadAfter = loadavg()[0];
console.log(
	`\nCalibration: ${calibrationMs.toFixed(1)} ms wall, ${calibration.cpu.toFixed(1)} ms CPU for a 200×200 elimination (≈2.7 M multiply-adds); divide by it to compare machines.`
);
console.log(
	`Load average (1 min): ${loadBefore.toFixed(1)} before, ${loadAfter.toFixed(1)} after; whole run ${((performance.now() - began) / 1000).toFixed(0)} s.`
);
console.log(
	`Targets: 50 elements ≤ 5 ms: ${t50.toFixed(2)} ms ${t50 <= 5 ? 'met' : 'MISSED'} (50 capacitors, 101 elements: ${t50caps.toFixed(2)} ms ${t50caps <= 5 ? 'met' : 'missed'}); 300 capacitors ≤ 1 s: ${t300.toFixed(0)} ms ${t300 <= 1000 ? 'met' : 'MISSED'}; 200-point response of 300 capacitors ≤ 50 ms: ${tResp.toFixed(1)} ms ${tResp <= 50 ? 'met' : 'MISSED'}`
);

mkdirSync('bench-results', { recursive: true });
writeFileSync(
	'bench-results/solver.json',
	JSON.stringify(
		{
			date: new Date().toISOString(),
			node: process.version,
			calibrationMs,
			calibrationCpuMs: calibration.cpu,
			load: [loadBefore, loadAfter],
			analysis: rows,
			exactly50Elements: fifty,
			response300,
			versus,
			sweep
		},
		null,
		2
	) + '\n'
);
