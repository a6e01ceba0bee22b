// The process entries of the built app, bundled after `vite build` next to adapter-node's
// server: build/start.js (what `node build` runs: settings check, schema check, then the web
// server and/or the job runner by POLEWISE_ROLE) and build/migrate.js (the deployment's migrate
// command). Runtime dependencies stay imports from node_modules, so `npm ci --omit=dev` plus
// build/ is enough to run both; everything else (SvelteKit's error helpers, JSON files) is
// bundled in.
import { build } from 'esbuild';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const pkg = JSON.parse(readFileSync(path.join(root, 'package.json'), 'utf8'));
const entries = {
	start: 'src/lib/server/process/start.ts',
	migrate: 'src/lib/server/process/migrate.ts'
};
for (const [name, source] of Object.entries(entries)) {
	await build({
		entryPoints: [path.join(root, source)],
		outfile: path.join(root, 'build', `${name}.js`),
		bundle: true,
		platform: 'node',
		format: 'esm',
		target: 'node20',
		external: Object.keys(pkg.dependencies),
		alias: { $lib: path.join(root, 'src/lib') },
		logLevel: 'warning'
	});
}
// `node build` starts build/start.js instead of adapter-node's index.js (which start.js loads).
writeFileSync(
	path.join(root, 'build', 'package.json'),
	JSON.stringify({ type: 'module', main: 'start.js' }, null, '\t') + '\n'
);
console.log(
	`  bundled ${Object.keys(entries)
		.map((n) => `build/${n}.js`)
		.join(', ')}`
);
