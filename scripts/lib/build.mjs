import { existsSync, mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import path from 'node:path';
import { run } from './run.mjs';
import { step } from './log.mjs';

const INPUTS = ['src', 'static', 'package-lock.json', 'svelte.config.js', 'vite.config.ts', 'tailwind.config.ts', 'postcss.config.js', 'scripts/build-workers.mjs'];

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

function buildIfStale(root, { force = false } = {}) {
	const marker = path.join(root, 'build', 'handler.js');
	const built = existsSync(marker) ? statSync(marker).mtimeMs : 0;
	const inputs = Math.max(...INPUTS.map((p) => newestMtime(path.join(root, p))));
	if (!force && built > inputs && existsSync(path.join(root, 'build', 'workers'))) return;
	step('Building the app (vite build + workers)');
	run('npm', ['run', '-s', 'build'], { cwd: root });
}
