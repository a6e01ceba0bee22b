import { defineConfig } from '@playwright/test';

// `npm test` sets E2E_PORT, DATABASE_URL (a seeded throwaway database) and the mail catcher's
// addresses; Playwright starts the built app on that port.
const port = Number(process.env.E2E_PORT ?? 4173);

export default defineConfig({
	testDir: 'tests/e2e',
	fullyParallel: false,
	workers: 1,
	retries: 0,
	// Generous: the suite also runs on a loaded 2-core machine, where a cold page can take seconds.
	timeout: 60_000,
	expect: { timeout: 10_000 },
	reporter: [['list'], ['json']],
	// `npm test` points this into the run's own temporary folder (removed afterwards); screenshots
	// and files a test makes go there through testInfo.outputPath (tests/e2e/artifacts.ts).
	outputDir: process.env.POLEWISE_TEST_OUTPUT ?? 'test-results',
	use: {
		baseURL: `http://127.0.0.1:${port}`,
		trace: 'retain-on-failure',
		launchOptions: { executablePath: '/usr/bin/chromium', args: ['--disable-gpu', '--disable-quic'] }
	},
	webServer: {
		// npm test serves a private copy of the build (see scripts/lib/build.mjs).
		command: `node ${process.env.POLEWISE_SERVE_DIR ?? 'build'}`,
		url: `http://127.0.0.1:${port}/api/health`,
		reuseExistingServer: false,
		timeout: 60_000,
		env: { ...(process.env as Record<string, string>), HOST: '127.0.0.1', PORT: String(port), ORIGIN: `http://127.0.0.1:${port}` }
	}
});
