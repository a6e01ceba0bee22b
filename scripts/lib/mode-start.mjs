// `npm start` (built app) and `npm run dev` (Vite dev server), both against the local cluster.
import path from 'node:path';
import { readConfig } from './config.mjs';
import { chooseDataRoot, startCluster } from './postgres.mjs';
import { ensureBuild } from './build.mjs';
import { isPortFree } from './ports.mjs';
import { run } from './run.mjs';
import { SetupError, step } from './log.mjs';
import { startChild, stopChildren, tsx } from './services.mjs';
import { supervise } from './supervise.mjs';
import { startMailFake } from './mail.mjs';

export async function main({ root, dev }) {
	const config = readConfig();
	if (!(await isPortFree(config.appPort, config.appHost))) {
		throw new SetupError(
			`Port ${config.appPort} on ${config.appHost} is already in use, so Polewise cannot serve there.`,
			`Stop the program using it, or pick another port: PORT=3001 npm ${dev ? 'run dev' : 'start'}`
		);
	}

	let cluster = null;
	let databaseUrl = config.externalDatabaseUrl;
	if (!databaseUrl) {
		const dataRoot = chooseDataRoot(path.join(root, '.data'), root);
		cluster = await startCluster({ dataRoot, port: config.dbPort, database: 'polewise' });
		databaseUrl = cluster.url;
	}
	const children = [];
	let app = null;
	const shutdown = () => {
		if (app) void app.stop();
		stopChildren(children);
		cluster?.stop();
	};
	process.once('SIGINT', () => {
		console.log('\nStopping Polewise and its database…');
		shutdown();
		process.exit(0);
	});
	process.once('SIGTERM', () => {
		shutdown();
		process.exit(0);
	});

	try {
		const env = { DATABASE_URL: databaseUrl };
		// Demo accounts (with the passwords printed in the README) only ever go into the local
		// cluster; a database named by DATABASE_URL is migrated and nothing more.
		if (cluster) step('Migrating the database and seeding the demo workspace');
		else step('Migrating the database given by DATABASE_URL (no demo data is added to it)');
		run(tsx(root), ['scripts/db.ts', cluster ? 'setup' : 'migrate'], { cwd: root, env: { ...process.env, ...env } });

		const mail = await startMailFake(root, config, children);
		Object.assign(env, mail.env);

		const origin = `http://${config.appHost === '0.0.0.0' ? '127.0.0.1' : config.appHost}:${config.appPort}`;
		if (!dev) ensureBuild(root);
		// A dying app process is started again (supervise.mjs); the database stays up.
		app = supervise({
			name: dev ? 'dev server' : 'app',
			start: dev
				? () => startChild(root, path.join(root, 'node_modules', '.bin', 'vite'), ['dev', '--host', config.appHost, '--port', String(config.appPort), '--strictPort'], env, { name: 'vite' })
				: // build/start.js checks the settings and sets the request-body limit itself.
					() => startChild(root, process.execPath, ['build'], { ...env, HOST: config.appHost, PORT: String(config.appPort), ORIGIN: process.env.ORIGIN ?? origin }, { name: 'app' })
		});
		console.log(`
  Polewise is running at  ${origin}
  Demo sign-in:           ${cluster ? 'demo@polewise.test  /  polewise-demo' : '(none: no demo data in a DATABASE_URL database)'}
  Caught e-mail:          ${mail.inboxUrl ?? 'sent through ' + (process.env.SMTP_URL ?? 'SMTP')}
  Database:               ${cluster ? databaseUrl : 'the one DATABASE_URL names'}
    (more processes on it: DATABASE_URL=… POLEWISE_ROLE=worker node build; see README "Scaling out")
  Stop with Ctrl-C (the app and its database stop together; data is kept in .data/).
  If the app process dies it is restarted; the database stays up.
`);
		const code = await app.done;
		shutdown();
		process.exit(code);
	} catch (error) {
		shutdown();
		throw error;
	}
}
