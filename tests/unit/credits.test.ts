// The credits page lists what ships to the browser with the notices the licences ask for; this
// keeps it true to what is installed (name, version, licence, copyright line).
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { CREDITS } from '../../src/lib/credits';

const root = path.resolve(__dirname, '../..');
const pkg = (name: string) => JSON.parse(readFileSync(path.join(root, 'node_modules', name, 'package.json'), 'utf8'));
const licenceFile = (name: string) => {
	const dir = path.join(root, 'node_modules', name);
	const f = readdirSync(dir).find((x) => /^licen[cs]e/i.test(x));
	return f ? readFileSync(path.join(dir, f), 'utf8') : '';
};

describe('credits', () => {
	it.each(CREDITS.map((c) => [c.name, c] as const))('%s: version, licence and copyright as installed', (name, c) => {
		const p = pkg(name);
		expect(c.version).toBe(p.version);
		expect(c.licence).toBe(p.license);
		// The notice's holder is the one in the package's own licence file.
		const holder = c.copyright.replace(/^Copyright (\(c\) )?[\d-]+ /, '').split(' (')[0];
		expect(licenceFile(name)).toContain(holder.replace('Svelte Contributors', '[Svelte Contributors]'));
	});

	it('the canvas library is credited, and the canvas carries no attribution mark', () => {
		expect(CREDITS.map((c) => c.name)).toContain('@xyflow/svelte');
		const canvas = readFileSync(path.join(root, 'src/lib/components/editor/schematic-canvas.svelte'), 'utf8');
		expect(canvas).toContain('hideAttribution: true');
	});
});
