/**
 * `npx tsx scripts/check-backends.ts [COUNT]` (part of `npm run bench`): the dense and the sparse
 * back end on COUNT (default 200) random networks of 200–1,000 elements — RC meshes, RC with a
 * capacitively coupled island, RLC and networks with controlled sources, voltage or current
 * input — compared quantity by quantity (tests/unit/solver/backend-compare.ts: the 10 slowest
 * poles, every open-circuit τ, the sequential steps, DC gain, the response against the dense
 * direct solve, the dominant pole's owner) to 1e-9. The unit tests run five of these; this runs
 * the full set. Prints the worst difference per quantity; exit 1 when any exceeds 1e-9.
 */
import { compareBackends } from '../tests/unit/solver/backend-compare';
import { randomNetwork, rng, type NetworkClass } from '../tests/unit/solver/random-networks';
import { loadavg } from 'node:os';

const count = Number(process.argv[2] ?? 200);
const classes: NetworkClass[] = ['rc', 'rc-floating', 'rlc', 'active'];
const r = rng(2026);
const worst: Record<string, { err: number; at: string }> = {};
let failed = 0;
const began = performance.now();
for (let i = 0; i < count; i++) {
	const kind = classes[i % classes.length];
	const size = 200 + Math.floor(r() * 801);
	const seed = 1000 + i;
	const at = `${kind} ${size} (seed ${seed})`;
	try {
		const { worst: w } = compareBackends(randomNetwork(kind, size, seed));
		for (const [what, err] of Object.entries(w)) {
			if (!worst[what] || err > worst[what].err) worst[what] = { err, at };
			if (err > 1e-9) {
				failed++;
				process.stderr.write(`${at}: ${what} differs by ${err.toExponential(2)}\n`);
			}
		}
	} catch (e) {
		failed++;
		process.stderr.write(`${at}: ${(e as Error).message}\n`);
	}
	if ((i + 1) % 20 === 0)
		process.stderr.write(
			`${i + 1}/${count} networks, ${((performance.now() - began) / 1000).toFixed(0)} s\n`
		);
}
console.log(
	`\nDense against sparse on ${count} random networks of 200–1,000 elements (load ${loadavg()[0].toFixed(1)}):`
);
for (const [what, { err, at }] of Object.entries(worst))
	console.log(`  ${what.padEnd(18)} worst ${err.toExponential(2)}  (${at})`);
console.log(
	`${failed === 0 ? 'all within 1e-9' : `${failed} differences above 1e-9`}; ${((performance.now() - began) / 1000).toFixed(0)} s`
);
process.exit(failed === 0 ? 0 : 1);
