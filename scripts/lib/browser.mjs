import { existsSync } from 'node:fs';
import { run } from './run.mjs';
import { SetupError, step } from './log.mjs';

export const CHROMIUM = '/usr/bin/chromium';

// What the browser tests need from Debian: Chromium to drive (never a test tool's own browser
// download) and poppler's pdftoppm/pdftotext to open the PDF reports the app produces.
const NEEDED = [
	{ file: CHROMIUM, pkg: 'chromium' },
	{ file: '/usr/bin/pdftotext', pkg: 'poppler-utils' }
];

export function ensureBrowserTools() {
	const missing = NEEDED.filter((n) => !existsSync(n.file)).map((n) => n.pkg);
	if (!missing.length) return;
	if (process.getuid?.() !== 0) {
		throw new SetupError(`The browser tests need Debian’s ${missing.join(' and ')}, which ${missing.length > 1 ? 'are' : 'is'} missing.`, `Install, then run again:\n    sudo apt-get install -y ${missing.join(' ')}`);
	}
	step(`Installing ${missing.join(' and ')} from Debian’s packages (for the browser tests)`);
	run('apt-get', ['update', '-qq']);
	run('apt-get', ['install', '-y', '-qq', ...missing], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
}
