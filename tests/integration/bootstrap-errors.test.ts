// The set-up problems a newcomer can hit each get a message that says what happened and what
// to do (issue: port in use, PostgreSQL missing without root, a data folder of another version).
import { chmodSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
// @ts-expect-error plain ESM bootstrap helpers without type declarations
import { ensurePostgresInstalled, startCluster } from '../../scripts/lib/postgres.mjs';
// @ts-expect-error plain ESM bootstrap helpers without type declarations
import { freePort } from '../../scripts/lib/ports.mjs';

const scratch: string[] = [];
function tempRoot() {
	const dir = mkdtempSync(path.join(os.tmpdir(), 'polewise-boot-'));
	chmodSync(dir, 0o755);
	scratch.push(dir);
	return dir;
}
afterEach(() => {
	for (const dir of scratch.splice(0)) rmSync(dir, { recursive: true, force: true });
});

describe('bootstrap set-up errors', () => {
	it('PostgreSQL missing and not root: names the package and the exact command', () => {
		expect(() => ensurePostgresInstalled({ base: '/nonexistent/postgresql', asRoot: false })).toThrow(
			expect.objectContaining({
				message: expect.stringContaining('PostgreSQL server binaries are missing'),
				hint: expect.stringContaining('sudo apt-get install -y postgresql')
			})
		);
	});

	it('a data folder made by another major version: says both versions and how to move it', async () => {
		const root = tempRoot();
		mkdirSync(path.join(root, 'postgres'), { recursive: true });
		writeFileSync(path.join(root, 'postgres', 'PG_VERSION'), '11\n');
		await expect(startCluster({ dataRoot: root, port: await freePort(), database: 'x', quiet: true })).rejects.toMatchObject({
			message: expect.stringMatching(/was made by PostgreSQL 11, but this machine has PostgreSQL \d+/),
			hint: expect.stringContaining('mv ')
		});
	});

	it('the database port already taken by another program: names the port and the variable', async () => {
		const blocker = net.createServer();
		await new Promise<void>((resolve) => blocker.listen(0, '127.0.0.1', resolve));
		const port = (blocker.address() as net.AddressInfo).port;
		try {
			await expect(startCluster({ dataRoot: tempRoot(), port, database: 'x', quiet: true })).rejects.toMatchObject({
				message: `Port ${port} on 127.0.0.1 is already in use by another program, so PostgreSQL cannot start there.`,
				hint: expect.stringContaining('POLEWISE_DB_PORT')
			});
		} finally {
			blocker.close();
		}
	});
});
