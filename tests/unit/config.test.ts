import { describe, expect, it } from 'vitest';
// @ts-expect-error plain ESM helper of the bootstrap, without type declarations
import { readConfig } from '../../scripts/lib/config.mjs';

describe('bootstrap configuration from the environment', () => {
	it('needs nothing set: loopback defaults and the non-default database port', () => {
		expect(readConfig({})).toMatchObject({ appHost: '127.0.0.1', appPort: 3000, dbPort: 54329, externalDatabaseUrl: null });
	});

	it('takes ports from the environment', () => {
		expect(readConfig({ PORT: '3100', POLEWISE_DB_PORT: '55000' })).toMatchObject({ appPort: 3100, dbPort: 55000 });
	});

	it.each(['abc', '0', '70000', '3.5'])('names the variable when a port is invalid (%s)', (raw) => {
		expect(() => readConfig({ POLEWISE_DB_PORT: raw })).toThrow(`POLEWISE_DB_PORT must be a port number from 1 to 65535, not "${raw}"`);
	});
});
