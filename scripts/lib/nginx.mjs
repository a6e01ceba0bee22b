// nginx for the multi-process test (tests/integration/multi-process.test.ts): Debian's package,
// installed with apt when missing, as PostgreSQL and Chromium are. The package's own service is
// kept from starting during the install (Debian's policy-rc.d convention, only while apt runs,
// and only when no policy of the machine's own exists): the test runs its own nginx on a free
// loopback port, and a system-wide one on port 80 is nobody's wish.
import { existsSync, rmSync, writeFileSync } from 'node:fs';
import { run } from './run.mjs';
import { SetupError, step } from './log.mjs';

export const NGINX = '/usr/sbin/nginx';
const POLICY = '/usr/sbin/policy-rc.d';

export function ensureNginx() {
	if (existsSync(NGINX)) return NGINX;
	if (process.getuid?.() !== 0) {
		throw new SetupError('The multi-process test needs Debian’s nginx, which is missing.', 'Install it, then run again:\n    sudo apt-get install -y nginx-light');
	}
	step('Installing nginx from Debian’s packages (for the multi-process test)');
	const ownPolicy = !existsSync(POLICY);
	if (ownPolicy) writeFileSync(POLICY, '#!/bin/sh\n# written by Polewise’s test set-up while apt runs: start no services\nexit 101\n', { mode: 0o755 });
	try {
		run('apt-get', ['update', '-qq']);
		run('apt-get', ['install', '-y', '-qq', 'nginx-light'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
	} finally {
		if (ownPolicy) rmSync(POLICY, { force: true });
	}
	if (!existsSync(NGINX)) throw new SetupError('apt-get finished but nginx is still missing.');
	return NGINX;
}
