/**
 * `npm run bench` (second part): the design aids' speed. A 200-point sweep and a 10,000-run
 * Monte Carlo on the demo divider and on a generated 100-element network, each timed per
 * evaluation, against a full analyze() of the same network for scale (what a naive loop that
 * re-parses and re-assembles each run would pay at least). Prints a table; writes
 * bench-results/design.json.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { analyze } from '../src/lib/solver/index';
import { digitizerDivider } from '../src/lib/server/db/seed/demo-sheets';
import { sweep } from '../src/lib/design/sweep';
import { monteCarlo } from '../src/lib/design/tolerance';
import { sensitivity } from '../src/lib/design/sensitivity';
import { randomNetwork, seededRandom } from '../src/lib/design/test-networks';

type Doc = { elements: { id: string; type: string; value?: unknown }[] };

function hundredElements(): Doc {
	for (let nodes = 30; ; nodes++) {
		const doc = randomNetwork(seededRandom(2026), nodes);
		if (doc.elements.length >= 100) return doc;
	}
}

const time = (f: () => void) => {
	const t = performance.now();
	f();
	return performance.now() - t;
};

function bench(name: string, doc: Doc, sweepElement: string) {
	const element = doc.elements.find((e) => e.id === sweepElement)!;
	const x = typeof element.value === 'number' ? element.value : 6.8e-12;
	analyze(doc); // warm-up
	const analyzeMs = Math.min(...Array.from({ length: 5 }, () => time(() => analyze(doc))));
	const sweepMs = time(() =>
		sweep(doc, {
			axes: [{ element: sweepElement, from: x / 3, to: x * 3, points: 200, scale: 'log' }]
		})
	);
	const tolerances = doc.elements
		.filter((e) => e.type === 'R' || e.type === 'C')
		.map((e) => ({
			element: e.id,
			tolerance: e.type === 'R' ? 0.01 : 0.05,
			distribution: 'uniform' as const
		}));
	const spec = { flatness: { withinDb: 0.5, fLo: 10, fHi: 1e5 } };
	const mcMs = time(() => monteCarlo(doc, { tolerances, runs: 10_000, seed: 1, spec }));
	const sensMs = time(() => sensitivity(doc));
	const reactive = doc.elements.filter((e) => e.type === 'C' || e.type === 'L').length;
	return {
		name,
		elements: doc.elements.length,
		reactive,
		analyzeMs,
		sweepMs,
		sweepPerPointMs: sweepMs / 200,
		mcMs,
		mcPerRunMs: mcMs / 10_000,
		sensitivityMs: sensMs
	};
}

const rows = [
	bench('demo divider (digitizerDivider)', digitizerDivider, 'Ctop'),
	bench('100-element random network', hundredElements(), 'C1')
];
const f = (x: number) => (x < 10 ? x.toFixed(3) : x.toFixed(0));
console.log('\nDesign aids (ms)');
console.log(
	'network                            elements reactive  analyze  sweep200  per point  MC10000  per run  sensitivity'
);
for (const r of rows) {
	console.log(
		`${r.name.padEnd(34)} ${String(r.elements).padStart(8)} ${String(r.reactive).padStart(8)} ${f(r.analyzeMs).padStart(8)} ${f(r.sweepMs).padStart(9)} ${f(r.sweepPerPointMs).padStart(10)} ${f(r.mcMs).padStart(8)} ${f(r.mcPerRunMs).padStart(8)} ${f(r.sensitivityMs).padStart(12)}`
	);
}
mkdirSync('bench-results', { recursive: true });
writeFileSync(
	'bench-results/design.json',
	JSON.stringify({ when: new Date().toISOString(), node: process.version, rows }, null, 2)
);
console.log('\nwritten bench-results/design.json');
