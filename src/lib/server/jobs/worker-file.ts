// Where a worker-thread entry lives: the TypeScript source (dev server, tests: run through tsx)
// or the bundled build/workers/NAME.worker.mjs that scripts/build-workers.mjs writes.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export function workerFile(name: string, from: string): { filename: string; execArgv: string[] } {
	const here = path.dirname(fileURLToPath(from));
	const source = path.join(here, '..', 'workers', `${name}.worker.ts`);
	if (existsSync(source)) return { filename: source, execArgv: ['--import', 'tsx'] };
	// Built: the chunk sits somewhere below build/server; the workers sit in build/workers.
	let dir = here;
	for (let i = 0; i < 10; i++) {
		const candidate = path.join(dir, 'workers', `${name}.worker.mjs`);
		if (existsSync(candidate)) return { filename: candidate, execArgv: [] };
		dir = path.dirname(dir);
	}
	throw new Error(`${name} worker not found: run \`npm run build\` (it bundles build/workers)`);
}
