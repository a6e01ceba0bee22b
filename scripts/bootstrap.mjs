#!/usr/bin/env node
// The two commands of the README (`npm start`, `npm test`) and `npm run dev` all begin here.
// Only Node's built-ins are used until dependencies are installed.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { reportAndExit } from './lib/log.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const command = process.argv[2];

try {
	ensureDependencies(root);
	const modes = { start: './lib/mode-start.mjs', dev: './lib/mode-start.mjs', test: './lib/mode-test.mjs' };
	if (!modes[command]) throw new Error(`usage: node scripts/bootstrap.mjs start|dev|test`);
	const mode = await import(modes[command]);
	await mode.main({ root, dev: command === 'dev', args: process.argv.slice(3) });
} catch (error) {
	reportAndExit(error);
}
