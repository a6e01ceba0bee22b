import { describe, expect, test } from 'vitest';
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { analyze } from '../../src/lib/solver/index';
import { checkDocument, readOptions } from '../../src/lib/server/analysis-request';
import { readTrim, skipped, trimAnalysis } from '../../src/lib/server/analysis-omit';

/**
 * `npm run analyze` takes POST /api/analyze's query options and answers what the route answers:
 * the route's own steps (readOptions, readTrim, checkDocument, analyze with skipped(), trim) are
 * run here in process on the same query and compared with the command's JSON.
 */
const FILE = 'docs/examples/probe-10x.json';
const run = (...args: string[]) =>
	execFileSync(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', FILE, ...args], {
		encoding: 'utf8'
	});

describe('analyze command: the API query options', () => {
	test('same JSON as the route for points, fMin, stepPoints, omit and matrixPorts', () => {
		const query = 'points=31&fMin=10&stepPoints=40&omit=expansion,impedanceCurve&matrixPorts=1';
		const url = new URL(`http://x/?${query}`);
		const trim = readTrim(url);
		const doc = checkDocument(JSON.parse(readFileSync(FILE, 'utf8')));
		// Through JSON, as the route sends it (-0 becomes 0).
		const api = JSON.parse(
			JSON.stringify(trimAnalysis(analyze(doc, { ...readOptions(url), ...skipped(trim) }), trim))
		);
		const cli = JSON.parse(
			run(
				'--points=31',
				'--fMin',
				'10',
				'--stepPoints=40',
				'--omit=expansion,impedanceCurve',
				'--matrixPorts=1'
			)
		);
		expect(cli.frequencyResponse.f).toHaveLength(31);
		expect(cli.step.t).toHaveLength(40);
		expect(cli.expansion).toBeNull();
		expect({ ...cli, meta: { ...cli.meta, ms: 0 } }).toEqual({
			...api,
			meta: { ...api.meta, ms: 0 }
		});
	}, 30_000);
	test("a bad option is refused with the API's message and exit status 2", () => {
		try {
			run('--points=1');
			expect.unreachable();
		} catch (e) {
			const err = e as { status: number; stderr: string };
			expect(err.status).toBe(2);
			expect(err.stderr).toContain('points must be at least 2');
		}
	}, 30_000);
});
