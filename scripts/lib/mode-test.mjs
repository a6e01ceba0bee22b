// `npm test`: a throwaway PostgreSQL (own temporary folder, free port, removed afterwards), the
// mail catcher on free ports, then Vitest (unit + integration) and Playwright on the built app.
// Ends with one plain line "N passed, N failed" summing both runners.
import { chmodSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startCluster } from './postgres.mjs';
import { snapshotBuild } from './build.mjs';
import { ensureBrowserTools } from './browser.mjs';
import { ensureNginx } from './nginx.mjs';
import { freePort } from './ports.mjs';
import { run, runAsync } from './run.mjs';
import { step } from './log.mjs';
import { stopChildren, tsx } from './services.mjs';
import { startMailFake } from './mail.mjs';
import { scratchEnv } from './scratch.mjs';

function vitestCounts(file) {
	if (!existsSync(file)) return { passed: 0, failed: 1 };
	const report = JSON.parse(readFileSync(file, 'utf8'));
	// A file that failed to load counts as a failure even though it ran no test.
	const brokenFiles = (report.testResults ?? []).filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
	return { passed: report.numPassedTests, failed: report.numFailedTests + brokenFiles };
}

function playwrightCounts(file) {
	if (!existsSync(file)) return { passed: 0, failed: 1 };
	const { stats } = JSON.parse(readFileSync(file, 'utf8'));
	return { passed: stats.expected + stats.flaky, failed: stats.unexpected + (stats.interrupted ?? 0) };
}

export async function main({ root, args }) {
	// optional: unit | integration | e2e | bench-e2e (the browser measurements tagged @bench);
	// after e2e or bench-e2e, Playwright's own arguments (e.g. one test file)
	const only = args[0];
	const scratch = mkdtempSync(path.join(os.tmpdir(), 'polewise-test-'));
	chmodSync(scratch, 0o755); // the cluster's user must be able to enter it
	const children = [];
	const scratchBuilds = [];
	let cluster = null;
	const cleanup = () => {
		stopChildren(children);
		cluster?.stop();
		rmSync(scratch, { recursive: true, force: true });
		for (const dir of scratchBuilds) rmSync(dir, { recursive: true, force: true });
	};
	process.once('SIGINT', () => {
		cleanup();
		process.exit(130);
	});

	const totals = { passed: 0, failed: 0 };
	const add = ({ passed, failed }) => {
		totals.passed += passed;
		totals.failed += failed;
	};
	try {
		cluster = await startCluster({ dataRoot: scratch, port: await freePort(), database: 'polewise_test', quiet: true });
		const e2eUrl = cluster.ensureDatabase('polewise_e2e');
		const mailPorts = { mailPort: await freePort(), mailWebPort: await freePort() };
		const mail = await startMailFake(root, mailPorts, children, { quiet: true });
		const env = { ...process.env, DATABASE_URL: cluster.url, ...mail.env, POLEWISE_TEST: '1', ...scratchEnv(scratch) };
		step(`Test database on 127.0.0.1:${cluster.port} (throwaway, in ${scratch})`);

		// The built app, for the multi-process integration test and the browser tests: a private
		// copy, since other runs on this checkout may rebuild build/ meanwhile.
		let serveDir = null;
		const served = () => {
			if (!serveDir) scratchBuilds.push((serveDir = snapshotBuild(root)));
			return serveDir;
		};

		if (!only || only === 'unit' || only === 'integration') {
			const projects = only ? ['--project', only] : ['--project', 'unit', '--project', 'integration'];
			const report = path.join(scratch, 'vitest.json');
			const extra = only === 'unit' ? {} : { POLEWISE_SERVE_DIR: served(), POLEWISE_NGINX: ensureNginx() };
			step('Unit and integration tests (Vitest)');
			await runAsync(path.join(root, 'node_modules/.bin/vitest'), ['run', ...projects, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`], { cwd: root, env: { ...env, ...extra } });
			add(vitestCounts(report));
		}

		if (!only || only === 'e2e' || only === 'bench-e2e') {
			ensureBrowserTools();
			const serveDir = served();
			run(tsx(root), ['scripts/db.ts', 'setup'], { cwd: root, env: { ...env, DATABASE_URL: e2eUrl }, stdio: 'ignore' });
			const report = path.join(scratch, 'playwright.json');
			step('Browser tests (Playwright on Debian’s Chromium)');
			const grep = only === 'bench-e2e' ? ['--grep', '@bench'] : ['--grep-invert', '@bench'];
			await runAsync(path.join(root, 'node_modules/.bin/playwright'), ['test', ...grep, ...args.slice(1)], {
				cwd: root,
				env: { ...env, DATABASE_URL: e2eUrl, E2E_PORT: String(await freePort()), POLEWISE_SERVE_DIR: serveDir, POLEWISE_SIGNUPS_PER_HOUR: '500', PLAYWRIGHT_JSON_OUTPUT_NAME: report }
			});
			add(playwrightCounts(report));
		}
	} finally {
		cleanup();
	}
	console.log(`\n${totals.passed} passed, ${totals.failed} failed`);
	process.exit(totals.failed > 0 || totals.passed === 0 ? 1 : 0);
}
