/**
 * `npx tsx scripts/bench-time-constant-view.ts`: what the time-constant view adds to one analysis
 * — the ports, the series–parallel formulas (both configurations) and the doublets with their
 * closing changes — on the demo sheets and a 50-section RC ladder, median of 60 runs after 20
 * warm-up runs. Prints one line per network; figures go into docs/performance.md.
 */
import { analyze } from '../src/lib/solver/index';
import { validateNetwork } from '../src/lib/solver/validate';
import { groupReactivePorts } from '../src/lib/solver/reactive-ports';
import { resistanceFormulas } from '../src/lib/solver/resistance-formulas';
import { findDoublets } from '../src/lib/solver/doublets';
import { demoSheets } from '../src/lib/server/db/seed/demo-sheets';
import { loadavg } from 'node:os';

const opts = {
	frequency: { points: 200 },
	step: { points: 300 },
	expansion: false as const,
	impedanceCurve: false as const,
	doubletRatio: 0.5
};
const median = (f: () => void) => {
	for (let i = 0; i < 20; i++) f();
	const ts: number[] = [];
	for (let i = 0; i < 60; i++) {
		const t = performance.now();
		f();
		ts.push(performance.now() - t);
	}
	return ts.sort((a, b) => a - b)[30];
};
function ladder(n: number) {
	const elements: { id: string; type: string; nodes: string[]; value: string | number }[] = [
		{ id: 'Vin', type: 'V', nodes: ['n0', 'gnd'], value: 1 }
	];
	for (let k = 1; k <= n; k++) {
		elements.push({ id: `R${k}`, type: 'R', nodes: [`n${k - 1}`, `n${k}`], value: '1k' });
		elements.push({ id: `C${k}`, type: 'C', nodes: [`n${k}`, 'gnd'], value: '1n' });
	}
	return {
		schema: 1,
		title: `RC ladder, ${n} sections`,
		elements,
		input: 'Vin',
		output: { node: `n${n}` }
	};
}

console.log(
	`load average ${loadavg()
		.map((x) => x.toFixed(1))
		.join(' ')}`
);
for (const { name, document } of [
	...demoSheets,
	{ name: 'RC ladder, 50 sections', document: ladder(50) }
]) {
	const a = analyze(document, opts);
	const net = validateNetwork(document);
	const { net: tcNet } = groupReactivePorts(net);
	const oc = a.timeConstants.openCircuit;
	const sc = a.timeConstants.shortCircuit;
	const whole = median(() => analyze(document, opts));
	const ports = median(() => groupReactivePorts(net));
	const formulas = median(() => {
		resistanceFormulas(tcNet, 'open', oc);
		resistanceFormulas(tcNet, 'short', sc);
	});
	const doublets = median(() => findDoublets(net, a.poles, a.zeros, a.dcGain, { oc, sc }, 0.5));
	console.log(
		`${name.padEnd(40)} analysis ${whole.toFixed(2)} ms; ports ${ports.toFixed(3)} ms, formulas ${formulas.toFixed(3)} ms, doublets ${doublets.toFixed(3)} ms (${a.doublets.length} doublet(s))`
	);
}
