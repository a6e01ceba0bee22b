// The bootstrap's settings (ports of the local services), with defaults that need none.
// Documented in README.md. The app's own settings are checked by src/lib/server/config; the
// listen address and port defaults come from the same file, so `npm start` and `node build`
// agree.
import { readFileSync } from 'node:fs';

const DEFAULTS = JSON.parse(readFileSync(new URL('../../src/lib/server/config/defaults.json', import.meta.url), 'utf8'));

export function readConfig(env = process.env) {
	const int = (name, fallback) => {
		const raw = env[name];
		if (raw === undefined || raw === '') return fallback;
		const value = Number(raw);
		if (!Number.isInteger(value) || value < 1 || value > 65535) {
			throw new Error(`${name} must be a port number from 1 to 65535, not "${raw}"`);
		}
		return value;
	};
	return {
		appPort: int('PORT', DEFAULTS.port),
		appHost: env.HOST || DEFAULTS.host,
		dbPort: int('POLEWISE_DB_PORT', 54329),
		mailPort: int('POLEWISE_MAIL_PORT', 54325),
		mailWebPort: int('POLEWISE_MAIL_WEB_PORT', 54326),
		externalDatabaseUrl: env.DATABASE_URL || null
	};
}
