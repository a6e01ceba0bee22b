import { existsSync } from 'node:fs';
import { run } from './run.mjs';
import { SetupError, step } from './log.mjs';

export const CHROMIUM = '/usr/bin/chromium';

/** Debian's Chromium for the browser tests (never a browser download of a test tool's own). */
export function ensureChromium() {
	if (existsSync(CHROMIUM)) return;
	if (process.getuid?.() !== 0) {
		throw new SetupError('Chromium is missing (/usr/bin/chromium), and the browser tests need it.', 'Install Debian’s package, then run again:\n    sudo apt-get install -y chromium');
	}
	step('Installing Chromium from Debian’s packages (for the browser tests)');
	run('apt-get', ['update', '-qq']);
	run('apt-get', ['install', '-y', '-qq', 'chromium'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
}
