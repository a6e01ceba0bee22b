// The SvelteKit build does not emit worker-thread entry files, so bundle each
// src/lib/server/workers/*.worker.ts into build/workers/*.mjs after `vite build`.
import { build } from 'esbuild';
import { existsSync, mkdirSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const source = path.join(root, 'src/lib/server/workers');
const out = path.join(root, 'build/workers');
mkdirSync(out, { recursive: true });
const entries = existsSync(source) ? readdirSync(source).filter((f) => f.endsWith('.worker.ts')) : [];
for (const file of entries) {
	await build({
		entryPoints: [path.join(source, file)],
		outfile: path.join(out, file.replace(/\.ts$/, '.mjs')),
		bundle: true,
		platform: 'node',
		format: 'esm',
		target: 'node20',
		alias: { $lib: path.join(root, 'src/lib') },
		logLevel: 'warning'
	});
}
console.log(`  bundled ${entries.length} worker(s) into build/workers`);
