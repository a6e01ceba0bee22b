// Settings read from the environment, with defaults that need none. Documented in README.md.
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
		appPort: int('PORT', 3000),
		appHost: env.HOST || '127.0.0.1',
		dbPort: int('POLEWISE_DB_PORT', 54329),
		mailPort: int('POLEWISE_MAIL_PORT', 54325),
		mailWebPort: int('POLEWISE_MAIL_WEB_PORT', 54326),
		externalDatabaseUrl: env.DATABASE_URL || null
	};
}
