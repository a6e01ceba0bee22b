// One Sequelize instance per process. `dialectModule: pg` keeps the driver a plain import that
// the SvelteKit build leaves for node_modules at run time.
import pg from 'pg';
import { Sequelize } from 'sequelize';
import { config } from '../config';

let instance: Sequelize | null = null;

export function databaseUrl(): string {
	const url = config().databaseUrl;
	if (!url) throw new Error('DATABASE_URL is not set (npm start and npm test set it for you)');
	return url;
}

export function db(): Sequelize {
	instance ??= new Sequelize(databaseUrl(), {
		dialect: 'postgres',
		dialectModule: pg,
		logging: false,
		// Bounded waits, so a database that is down or unreachable (packets dropped, no refusal)
		// turns into a 503 within seconds instead of requests hanging for minutes: 5 s to open
		// a connection, 10 s to get one from a busy pool.
		pool: { max: config().dbPoolMax, idle: 10_000, acquire: 10_000 },
		dialectOptions: { connectionTimeoutMillis: 5_000 },
		define: { underscored: true }
	});
	return instance;
}

export async function closeDb(): Promise<void> {
	if (instance) await instance.close();
	instance = null;
}

/** True when the database answers a trivial query within the timeout. */
export async function databaseAnswers(timeoutMs = 2000): Promise<boolean> {
	try {
		await Promise.race([
			db().query('SELECT 1'),
			new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), timeoutMs))
		]);
		return true;
	} catch {
		return false;
	}
}
