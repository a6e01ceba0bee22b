// Test hygiene (issue 16, item 11): a test run writes only into its own temporary folder, which
// the run removes at the end — no PNGs or pw-* folders loose in /tmp.
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
// @ts-expect-error plain ESM helper of the bootstrap, without type declarations
import { scratchEnv } from '../../scripts/lib/scratch.mjs';

const root = path.resolve(__dirname, '../..');
const scratch = mkdtempSync(path.join(os.tmpdir(), 'polewise-hygiene-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('where a test run writes', () => {
	it('TMPDIR and the browser tests’ output folder are inside the run’s scratch folder', () => {
		const env = scratchEnv(scratch) as Record<string, string>;
		for (const key of ['TMPDIR', 'TMP', 'TEMP', 'POLEWISE_TEST_OUTPUT']) {
			expect(path.relative(scratch, env[key]).startsWith('..'), key).toBe(false);
			expect(readdirSync(env[key])).toEqual([]);
		}
	});

	it('npm test passes that environment to its runners', () => {
		const mode = readFileSync(path.join(root, 'scripts/lib/mode-test.mjs'), 'utf8');
		expect(mode).toMatch(/\.\.\.scratchEnv\(scratch\)/);
	});

	it('Playwright writes its output where npm test says', async () => {
		process.env.POLEWISE_TEST_OUTPUT = path.join(scratch, 'out');
		const { default: config } = await import('../../playwright.config');
		expect(config.outputDir).toBe(path.join(scratch, 'out'));
		delete process.env.POLEWISE_TEST_OUTPUT;
	});

	it('no browser or integration test names a fixed path in /tmp or makes its own temp folder there', () => {
		const offenders: string[] = [];
		for (const dir of ['tests/e2e', 'tests/integration']) {
			for (const f of readdirSync(path.join(root, dir))) {
				if (!f.endsWith('.ts')) continue;
				const text = readFileSync(path.join(root, dir, f), 'utf8');
				if (/['"`]\/tmp\//.test(text)) offenders.push(`${dir}/${f}: a path in /tmp`);
				// A temp folder of its own is fine only when the test removes it again.
				if (/mkdtemp/.test(text) && !/rmSync\(/.test(text))
					offenders.push(`${dir}/${f}: a temp folder never removed`);
			}
		}
		expect(offenders).toEqual([]);
	});
});
