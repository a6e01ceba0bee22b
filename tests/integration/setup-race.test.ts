// Two set-ups at once on a fresh database (two `npm start`s, or a deploy script run twice), as
// real processes: the migration and the demo seeding each hold an advisory lock, so neither fails
// with "relation already exists" or a duplicate row; one does the work, the other finds it done.
import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { afterAll, beforeAll, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const name = `polewise_setup_${randomUUID().slice(0, 8)}`;
const url = Object.assign(new URL(process.env.DATABASE_URL!), { pathname: `/${name}` }).toString();

async function admin<T>(
	work: (c: pg.Client) => Promise<T>,
	connectionString = process.env.DATABASE_URL!
) {
	const c = new pg.Client({ connectionString });
	await c.connect();
	try {
		return await work(c);
	} finally {
		await c.end();
	}
}

function setup(): Promise<{ code: number | null; output: string }> {
	return new Promise((resolve) => {
		const child = spawn(`${root}/node_modules/.bin/tsx`, ['scripts/db.ts', 'setup'], {
			cwd: root,
			env: { ...process.env, DATABASE_URL: url }
		});
		let output = '';
		child.stdout.on('data', (d) => (output += d));
		child.stderr.on('data', (d) => (output += d));
		child.on('exit', (code) => resolve({ code, output }));
	});
}

beforeAll(() => admin((c) => c.query(`CREATE DATABASE ${name}`)));
afterAll(() => admin((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`)));

it('two set-ups at once: both exit 0, one migrates and seeds, the other finds both done', async () => {
	const runs = await Promise.all([setup(), setup()]);
	expect(runs.map((r) => r.code)).toEqual([0, 0]);
	const said = runs.map((r) => r.output);
	expect(
		said.filter((s) => s.includes('applied migrations: 0001-accounts-and-sheets'))
	).toHaveLength(1);
	expect(said.filter((s) => s.includes('database schema is up to date'))).toHaveLength(1);
	expect(said.filter((s) => s.includes('seeded the demo workspace'))).toHaveLength(1);
	expect(said.filter((s) => s.includes('demo workspace already present'))).toHaveLength(1);
	const users = await admin(
		(c) => c.query(`SELECT count(*)::int AS n FROM users WHERE email LIKE '%@polewise.test'`),
		url
	);
	expect(users.rows[0].n).toBe(2);
}, 90_000);
