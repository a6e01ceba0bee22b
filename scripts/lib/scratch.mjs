// Where a test run writes: everything goes into the run's own temporary folder (removed when the
// run ends), never loose into /tmp. Playwright's output folder (screenshots, traces, files the
// browser tests make) and TMPDIR for every runner and the browser live under it, so even a
// library that calls os.tmpdir() cleans up with the run.
import { mkdirSync } from 'node:fs';
import path from 'node:path';

/** Environment for the test runners of one run whose scratch folder is `scratch`. */
export function scratchEnv(scratch) {
	const tmp = path.join(scratch, 'tmp');
	const output = path.join(scratch, 'playwright-output');
	mkdirSync(tmp, { recursive: true });
	mkdirSync(output, { recursive: true });
	return { TMPDIR: tmp, TMP: tmp, TEMP: tmp, POLEWISE_TEST_OUTPUT: output };
}
