// docs/deploy.md shows the deployment files exactly as they are in deploy/ (the ones the
// multi-process test runs), so the page and the tested set-up cannot drift apart.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { neededBodyLimit } from '../../src/lib/server/config';
import DEFAULTS from '../../src/lib/server/config/defaults.json';

const root = path.resolve(import.meta.dirname, '../..');
const page = readFileSync(path.join(root, 'docs/deploy.md'), 'utf8');
const files = ['nginx', 'systemd'].flatMap((dir) =>
	readdirSync(path.join(root, 'deploy', dir)).map((f) => `deploy/${dir}/${f}`)
);

describe('docs/deploy.md', () => {
	it.each(files)('shows %s as it is', (file) => {
		expect(page).toContain(`\`${file}\`:\n\n\`\`\``);
		expect(page).toContain(readFileSync(path.join(root, file), 'utf8'));
	});

	it('nginx accepts the app’s default request-body limit', () => {
		const mib = neededBodyLimit(DEFAULTS.uploadLimitBytes) / (1024 * 1024);
		expect(readFileSync(path.join(root, 'deploy/nginx/polewise-locations.conf'), 'utf8')).toContain(
			`client_max_body_size ${mib}m;`
		);
	});
});
