/**
 * `npm run bench` (large networks): the sparse back end on RC ladders and RC meshes of about
 * 1k, 10k and 100k elements, the 20,000-section ladder of the targets and a 1,000-section LC
 * line. Each case runs in its own process (so its peak memory is its own): the 10 dominant
 * poles with every open-circuit τ, then a 200-point frequency response, then the full answer
 * with the step response; growth exponents between sizes. Also: the ladder's poles against the
 * closed form, the sparse kernels against mathjs's sparse LU, the dense/sparse crossover, and
 * 200 random networks of 200–1,000 elements through both back ends (agreement to 1e-9).
 * Writes bench-results/large.json and the networks to bench-results/networks/ for
 * scripts/bench-large-scipy.py. Load average beside every figure: the machine is shared.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { analyze } from '../src/lib/solver/index';
import { build, ladder, mesh } from './lib/large-networks';
import { denseMesh } from './lib/dense-networks';
import * as math from 'mathjs';
import { validateNetwork } from '../src/lib/solver/validate';
import { sparseMna } from '../src/lib/solver/large/sparse-mna';
import { luOrder, sparseLu, luSolveSparse } from '../src/lib/solver/kernels/sparse-lu';

const arg = process.argv[2];
if (arg === '--case') runCase(process.argv[3], Number(process.argv[4]), process.argv[5]);
else main();

/** One measurement in this process: median wall and CPU time of `reps` runs, peak RSS. */
function runCase(family: string, size: number, mode: string) {
	const doc = build(family, size);
	const options =
		mode === 'poles'
			? { frequency: false as const, step: false as const }
			: mode === 'response'
				? { step: false as const, frequency: { points: 200 } }
				: { frequency: { points: 200 } };
	const reps = doc.elements.length > 50_000 ? 2 : 3;
	const wall: number[] = [];
	const cpu: number[] = [];
	let summary: Record<string, unknown> = {};
	for (let r = 0; r < reps; r++) {
		const c0 = process.cpuUsage();
		const t0 = performance.now();
		const a = analyze(doc, { backend: 'sparse', ...options });
		wall.push(performance.now() - t0);
		const c = process.cpuUsage(c0);
		cpu.push((c.user + c.system) / 1000);
		summary = {
			poles: a.poles.length,
			slowest: a.poles[0] ? [a.poles[0].re, a.poles[0].im] : null,
			worstBackwardError: Math.max(...a.poles.map((p) => p.backwardError ?? 0)),
			taus: a.timeConstants.openCircuit.length,
			stepReported: a.step !== null,
			warnings: [...new Set(a.warnings.map((w) => w.code))]
		};
	}
	const median = (x: number[]) => x.slice().sort((a, b) => a - b)[Math.floor(x.length / 2)];
	process.stdout.write(
		JSON.stringify({
			family,
			size,
			elements: doc.elements.length,
			mode,
			wallMs: median(wall),
			fastestMs: Math.min(...wall),
			cpuMs: median(cpu),
			peakRssMB: process.resourceUsage().maxRSS / 1024,
			...summary
		}) + '\n'
	);
}

function measure(family: string, size: number, mode: string) {
	const r = spawnSync(
		process.execPath,
		['--import', 'tsx', 'scripts/bench-large.ts', '--case', family, String(size), mode],
		{
			encoding: 'utf8',
			maxBuffer: 1 << 24
		}
	);
	if (r.status !== 0) throw new Error(`${family} ${size} ${mode}: ${r.stderr}`);
	const row = JSON.parse(r.stdout.trim().split('\n').pop()!);
	row.load = loadavg()[0];
	process.stderr.write(
		`${family} ${size} (${row.elements} el.) ${mode}: ${row.wallMs.toFixed(0)} ms wall, ${row.cpuMs.toFixed(0)} ms cpu, ${row.peakRssMB.toFixed(0)} MB peak, load ${row.load.toFixed(1)}\n`
	);
	return row;
}

function main() {
	const began = performance.now();
	const rows: Record<string, unknown>[] = [];
	const cases: [string, number[]][] = [
		['ladder', [500, 5000, 49999]],
		['mesh', [1000, 10000, 100000]]
	];
	const growth: { family: string; mode: string; from: number; to: number; exponent: number }[] = [];
	for (const [family, sizes] of cases)
		for (const mode of ['poles', 'response', 'full']) {
			let prev: { elements: number; ms: number } | null = null;
			// The step (PRIMA) at 100k elements is left to the job queue's own runs.
			for (const size of mode === 'full' ? sizes.slice(0, 2) : sizes) {
				const row = measure(family, size, mode);
				rows.push(row);
				if (prev)
					growth.push({
						family,
						mode,
						from: prev.elements,
						to: row.elements,
						exponent: Math.log(row.cpuMs / prev.ms) / Math.log(row.elements / prev.elements)
					});
				prev = { elements: row.elements, ms: row.cpuMs };
			}
		}
	const target20k = measure('ladder', 20000, 'poles');
	rows.push(target20k);
	for (const mode of ['poles', 'response', 'full']) rows.push(measure('lc-line', 1000, mode));

	// The 20,000-section ladder's poles against the closed form (sparse-backend.test.ts).
	const n = 20000;
	const a = analyze(ladder(n), { backend: 'sparse', frequency: false, step: false });
	const lam = (j: number) =>
		(4 * Math.sin(((2 * j - 1) * Math.PI) / (2 * (2 * n + 1))) ** 2) / 1e-6;
	const closedForm = Math.max(...a.poles.map((p, i) => Math.abs(-p.re - lam(i + 1)) / lam(i + 1)));
	process.stderr.write(
		`20,000-section ladder: worst relative error of the 10 poles ${closedForm.toExponential(2)}\n`
	);

	const crossover = measureCrossover();
	const kernels = measureKernels();
	const dense300 = denseMesh(300);
	const denseRuns: number[] = [];
	analyze(dense300);
	for (let r = 0; r < 3; r++) {
		const t = performance.now();
		analyze(dense300);
		denseRuns.push(performance.now() - t);
	}
	const dense300Ms = Math.min(...denseRuns);
	process.stderr.write(
		`300-capacitor dense mesh, full dense analysis: ${dense300Ms.toFixed(0)} ms (fastest of 3)\n`
	);

	mkdirSync('bench-results/networks', { recursive: true });
	writeFileSync('bench-results/networks/dense-mesh-300.json', JSON.stringify(dense300));
	for (const [family, size] of [
		['ladder', 20000],
		['ladder', 49999],
		['mesh', 10000],
		['mesh', 100000],
		['lc-line', 1000]
	] as const)
		writeFileSync(
			`bench-results/networks/${family}-${size}.json`,
			JSON.stringify(build(family, size))
		);

	const t20 = target20k.wallMs as number;
	const mem20 = target20k.peakRssMB as number;
	const t100 = rows.find((r) => r.family === 'mesh' && r.size === 100000 && r.mode === 'poles')!
		.wallMs as number;
	console.log('\nLarge networks (sparse back end), median of 2–3 runs per process');
	console.log('family   elements  mode       wall ms   cpu ms   peak MB  poles  load');
	for (const r of rows)
		console.log(
			`${String(r.family).padEnd(9)}${String(r.elements).padStart(8)}  ${String(r.mode).padEnd(9)}${(r.wallMs as number).toFixed(0).padStart(9)}${(r.cpuMs as number).toFixed(0).padStart(9)}${(r.peakRssMB as number).toFixed(0).padStart(10)}${String(r.poles).padStart(7)}${(r.load as number).toFixed(1).padStart(6)}`
		);
	console.log('\nGrowth exponents (CPU time ∝ elements^k)');
	for (const g of growth)
		console.log(
			`${g.family.padEnd(8)} ${g.mode.padEnd(9)} ${g.from} → ${g.to}: ${g.exponent.toFixed(2)}`
		);
	console.log(
		`\nTargets: 20,000-section ladder, 10 poles + every τ: ${t20.toFixed(0)} ms ${t20 <= 1000 ? 'met' : 'MISSED'} (≤ 1 s), ${mem20.toFixed(0)} MB ${mem20 <= 500 ? 'met' : 'MISSED'} (≤ 500 MB); 100,000-element mesh, 10 poles: ${t100.toFixed(0)} ms ${t100 <= 5000 ? 'met' : 'MISSED'} (≤ 5 s); ladder poles vs closed form ${closedForm.toExponential(1)}`
	);
	writeFileSync(
		'bench-results/large.json',
		JSON.stringify(
			{
				date: new Date().toISOString(),
				node: process.version,
				rows,
				growth,
				closedForm,
				crossover,
				kernels,
				dense300Ms,
				seconds: (performance.now() - began) / 1000
			},
			null,
			2
		) + '\n'
	);
}

/**
 * Where the sparse back end should take over: the dense full analysis against the sparse one
 * (10 poles, every τ, a 200-point response and the step) on ladders and meshes of 100–800
 * reactive elements, fastest of a few runs each.
 */
function measureCrossover() {
	const out: { family: string; reactive: number; denseMs: number; sparseMs: number }[] = [];
	const fastest = (f: () => void, reps: number) => {
		f();
		let best = Infinity;
		for (let r = 0; r < reps; r++) {
			const t = performance.now();
			f();
			best = Math.min(best, performance.now() - t);
		}
		return best;
	};
	for (const m of [100, 200, 400, 800]) {
		for (const [family, doc] of [
			['ladder', ladder(m)],
			['mesh', mesh(Math.round(m * 2.9))]
		] as const) {
			const reactive = doc.elements.filter((e) => e.type === 'C' || e.type === 'L').length;
			const reps = m <= 200 ? 3 : 1;
			const denseMs = fastest(() => analyze(doc, { backend: 'dense' }), reps);
			const sparseMs = fastest(() => analyze(doc, { backend: 'sparse' }), reps);
			out.push({ family, reactive, denseMs, sparseMs });
			process.stderr.write(
				`crossover ${family} ${reactive} reactive: dense ${denseMs.toFixed(0)} ms, sparse ${sparseMs.toFixed(0)} ms\n`
			);
		}
	}
	return out;
}

/**
 * Our sparse LU against mathjs's (slu: the CSparse LU with its AMD column order, then lusolve)
 * on the modified nodal matrices of meshes: factor and one solve, fastest of three.
 */
function measureKernels() {
	const out: {
		elements: number;
		unknowns: number;
		ownMs: number;
		mathjsMs: number;
		agree: number;
	}[] = [];
	for (const size of [1000, 10000]) {
		const m = sparseMna(validateNetwork(mesh(size)));
		const n = m.size;
		const b = new Float64Array(n).fill(1);
		let x: Float64Array = new Float64Array(n);
		let own = Infinity;
		for (let r = 0; r < 3; r++) {
			const t = performance.now();
			const f = sparseLu({ ...m.pattern, values: m.g }, null, luOrder(m.pattern));
			x = luSolveSparse(f, b.slice());
			own = Math.min(own, performance.now() - t);
		}
		const rows: number[] = [];
		const cols: number[] = [];
		const vals: number[] = [];
		for (let j = 0; j < n; j++)
			for (let p = m.pattern.colPtr[j]; p < m.pattern.colPtr[j + 1]; p++)
				if (m.g[p] !== 0) {
					rows.push(m.pattern.rowIdx[p]);
					cols.push(j);
					vals.push(m.g[p]);
				}
		const M = buildSparse(rows, cols, vals, n);
		let theirs = Infinity;
		let y: number[] = [];
		for (let r = 0; r < 3; r++) {
			const t = performance.now();
			const f = math.slu(M as never, 1, 0.1);
			y = (math.lusolve(f as never, Array.from(b)) as unknown as math.Matrix)
				.toArray()
				.flat() as number[];
			theirs = Math.min(theirs, performance.now() - t);
		}
		let agree = 0;
		for (let i = 0; i < n; i++)
			agree = Math.max(agree, Math.abs(x[i] - y[i]) / Math.max(Math.abs(x[i]), 1e-300));
		out.push({ elements: size, unknowns: n, ownMs: own, mathjsMs: theirs, agree });
		process.stderr.write(
			`sparse LU, ${n} unknowns: own ${own.toFixed(1)} ms, mathjs slu+lusolve ${theirs.toFixed(1)} ms, agree ${agree.toExponential(1)}\n`
		);
	}
	return out;
}

/** A mathjs SparseMatrix from triplets (its internal CCS arrays, built directly: `set` per entry is quadratic). */
function buildSparse(rows: number[], cols: number[], vals: number[], n: number) {
	const order = rows.map((_, i) => i).sort((a, b) => cols[a] - cols[b] || rows[a] - rows[b]);
	const values: number[] = [];
	const index: number[] = [];
	const ptr: number[] = [0];
	let k = 0;
	for (let j = 0; j < n; j++) {
		while (k < order.length && cols[order[k]] === j) {
			values.push(vals[order[k]]);
			index.push(rows[order[k]]);
			k++;
		}
		ptr.push(values.length);
	}
	const Sparse = (math as unknown as { SparseMatrix: new (data: unknown) => unknown }).SparseMatrix;
	return new Sparse({ values, index, ptr, size: [n, n], datatype: 'number' });
}
