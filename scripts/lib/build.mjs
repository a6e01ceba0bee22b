import { existsSync, readdirSync, statSync } from 'node:fs';
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

/** Build the app when build/ is missing or older than any of its inputs. */
export function ensureBuild(root, { force = false } = {}) {
	const marker = path.join(root, 'build', 'handler.js');
	const built = existsSync(marker) ? statSync(marker).mtimeMs : 0;
	const inputs = Math.max(...INPUTS.map((p) => newestMtime(path.join(root, p))));
	if (!force && built > inputs && existsSync(path.join(root, 'build', 'workers'))) return;
	step('Building the app (vite build + workers)');
	run('npm', ['run', '-s', 'build'], { cwd: root });
}
