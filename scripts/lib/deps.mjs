import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { run } from './run.mjs';
import { step } from './log.mjs';

/** Install dependencies with `npm ci` when node_modules is missing or older than the lock file. */
export function ensureDependencies(root) {
	const lock = path.join(root, 'package-lock.json');
	const marker = path.join(root, 'node_modules', '.package-lock.json');
	if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
	step('Installing dependencies (npm ci)');
	run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root });
}
