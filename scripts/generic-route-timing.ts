/**
 * Times the generic dense route (scripts/lib/generic-dense-route.ts) on the 300-capacitor mesh
 * of scripts/bench.ts in a process of its own, and prints one JSON line: medians of `runs` runs
 * after `warmups` warm-ups (wall and process CPU), and the pole magnitudes for the comparison.
 *
 * A process of its own because merely loading ml-matrix (or mathjs) into the analysis' V8
 * isolate slowed the analysis by about 30 % on this machine (docs/performance.md); the solver
 * workers of the app load neither.
 *
 *     npx tsx scripts/generic-route-timing.ts [runs] [warmups]
 */
import { denseMesh } from './lib/dense-networks';
import { genericDenseRoute } from './lib/generic-dense-route';

const runs = Number(process.argv[2] ?? 9);
const warmups = Number(process.argv[3] ?? 15);
const doc = denseMesh(300);
for (let w = 0; w < warmups; w++) genericDenseRoute(doc);
const wall: number[] = [];
const cpu: number[] = [];
let poles: number[] = [];
for (let k = 0; k < runs; k++) {
	const c0 = process.cpuUsage();
	const w0 = performance.now();
	const r = genericDenseRoute(doc);
	wall.push(performance.now() - w0);
	const c = process.cpuUsage(c0);
	cpu.push((c.user + c.system) / 1000);
	poles = r.poles.map((p) => Math.hypot(p.re, p.im));
}
const median = (xs: number[]) => {
	const s = xs.slice().sort((a, b) => a - b);
	return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
console.log(JSON.stringify({ wallMs: median(wall), cpuMs: median(cpu), poles }));
