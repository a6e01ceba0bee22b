import { cpSync, existsSync, mkdirSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { run } from './run.mjs';
import { step } from './log.mjs';

const INPUTS = ['src', 'static', 'package-lock.json', 'svelte.config.js', 'vite.config.ts', 'tailwind.config.ts', 'postcss.config.js', 'scripts/build-workers.mjs', 'scripts/build-entries.mjs'];

function newestMtime(target) {
	if (!existsSync(target)) return 0;
	const stat = statSync(target);
	if (!stat.isDirectory()) return stat.mtimeMs;
	let newest = stat.mtimeMs;
	for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
	return newest;
}

/** A lock folder (mkdir is atomic) so two test runs on one checkout never build at once. */
function withBuildLock(root, work) {
	const lock = path.join(root, '.build-lock');
	const deadline = Date.now() + 10 * 60_000;
	for (;;) {
		try {
			mkdirSync(lock);
			break;
		} catch {
			// A lock older than ten minutes belongs to a run that died.
			if (existsSync(lock) && Date.now() - statSync(lock).mtimeMs > 10 * 60_000) rmSync(lock, { recursive: true, force: true });
			if (Date.now() > deadline) throw new Error('waited ten minutes for another build of this checkout to finish');
			Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 500);
		}
	}
	try {
		return work();
	} finally {
		rmSync(lock, { recursive: true, force: true });
	}
}

/** Build the app when build/ is missing or older than any of its inputs. */
export function ensureBuild(root, options = {}) {
	return withBuildLock(root, () => buildIfStale(root, options));
}

/**
 * A private copy of a fresh build for one test run: other runs on this checkout may rebuild
 * build/ while this one's browser tests are still being served. The copy stays inside the
 * project so the server's bare imports still resolve from node_modules.
 */
export function snapshotBuild(root) {
	return withBuildLock(root, () => {
		buildIfStale(root);
		const copy = path.join(root, '.test-builds', `run-${process.pid}-${Date.now()}`);
		cpSync(path.join(root, 'build'), copy, { recursive: true });
		return copy;
	});
}

function buildIfStale(root, { force = false } = {}) {
	// The build records the newest input time it saw when it *started*, so an edit made while a
	// build runs still counts as newer afterwards.
	const stamp = path.join(root, 'build', '.inputs-stamp.json');
	const inputs = Math.max(...INPUTS.map((p) => newestMtime(path.join(root, p))));
	const built = existsSync(stamp) ? JSON.parse(readFileSync(stamp, 'utf8')).inputs : -1;
	const complete = ['handler.js', 'workers', 'start.js', 'migrate.js', 'package.json'].every((f) => existsSync(path.join(root, 'build', f)));
	if (!force && built >= inputs && complete) return;
	step('Building the app (vite build + workers)');
	run('npm', ['run', '-s', 'build'], { cwd: root });
	writeFileSync(stamp, JSON.stringify({ inputs }));
}
