import { describe, expect, it } from 'vitest';
import { BODY_LIMITS } from '../api/respond';
import { SHEET_FILE_MAX_BYTES } from '../../exchange/sheet-file';
import DEFAULTS from './defaults.json';
import {
	ConfigError,
	LARGEST_JSON_BODY,
	neededBodyLimit,
	parseByteSize,
	readConfig,
	SETTINGS
} from './index';
// @ts-expect-error plain ESM helper of the bootstrap, without type declarations
import { readConfig as readBootstrapConfig } from '../../../../scripts/lib/config.mjs';

const MiB = 1024 * 1024;

describe('the one configuration module', () => {
	it('needs nothing set: loopback, port 3000, role all, a body limit that fits a 5 MB upload', () => {
		const c = readConfig({});
		expect(c).toMatchObject({
			role: 'all',
			host: '127.0.0.1',
			port: 3000,
			uploadLimitBytes: 5 * MiB,
			dbPoolMax: 10,
			jobStaleSeconds: 30,
			jobMaxAttempts: 3
		});
		// 5 MiB of file plus the form's room, rounded up to whole MiB (what nginx is told too).
		expect(c.bodySizeLimitBytes).toBe(6 * MiB);
	});

	it('npm start and node build share one listen address and port default', () => {
		const boot = readBootstrapConfig({});
		const app = readConfig({});
		expect([boot.appHost, boot.appPort]).toEqual([app.host, app.port]);
		expect(app.host).toBe(DEFAULTS.host);
	});

	it('the body limit follows the upload limit', () => {
		expect(readConfig({ POLEWISE_UPLOAD_LIMIT_BYTES: String(20 * MiB) }).bodySizeLimitBytes).toBe(
			21 * MiB
		);
		// Below the largest JSON body (saves, sheet files), that one decides.
		expect(neededBodyLimit(1024)).toBe(2 * MiB);
	});

	it('the largest JSON body is the one the routes enforce', () => {
		expect(LARGEST_JSON_BODY).toBe(BODY_LIMITS.document);
		expect(LARGEST_JSON_BODY).toBe(SHEET_FILE_MAX_BYTES);
	});

	it('a body limit set below what uploads need stops the start, naming both variables', () => {
		expect(() => readConfig({ BODY_SIZE_LIMIT: '512K' })).toThrow(
			/BODY_SIZE_LIMIT is 512K, below the 6M that uploads of up to 5242880 bytes \(POLEWISE_UPLOAD_LIMIT_BYTES\) need/
		);
		expect(readConfig({ BODY_SIZE_LIMIT: '8M' }).bodySizeLimitBytes).toBe(8 * MiB);
		expect(readConfig({ BODY_SIZE_LIMIT: 'Infinity' }).bodySizeLimitBytes).toBe(Infinity);
	});

	it.each([
		['POLEWISE_ROLE', 'wrker', 'POLEWISE_ROLE must be web, worker or all, not "wrker"'],
		['PORT', '70000', 'PORT must be a whole number from 1 to 65535, not "70000"'],
		['DB_POOL_MAX', 'ten', 'DB_POOL_MAX must be a whole number from 1 to 1000, not "ten"'],
		['DATABASE_URL', 'mysql://x@y/z', 'DATABASE_URL must be a URL like postgres://'],
		['ORIGIN', 'polewise.example.com', 'ORIGIN must be a URL like https://polewise.example.com'],
		['XFF_DEPTH', '0', 'XFF_DEPTH must be a whole number from 1 to 20, not "0"'],
		['ADDRESS_HEADER', 'X Forwarded', 'ADDRESS_HEADER must be a header name like X-Forwarded-For'],
		['BODY_SIZE_LIMIT', '6 MB', 'BODY_SIZE_LIMIT must be a size like 6M'],
		[
			'POLEWISE_JOB_STALE_SECONDS',
			'5',
			'POLEWISE_JOB_STALE_SECONDS must be a whole number from 10 to 3600'
		]
	])('a bad %s stops the start with a message naming it', (name, value, says) => {
		expect(() => readConfig({ [name]: value })).toThrow(says);
	});

	it('names every bad variable at once, one per line', () => {
		try {
			readConfig({ PORT: 'x', POLEWISE_ROLE: 'both' });
			expect.unreachable();
		} catch (e) {
			expect(e).toBeInstanceOf(ConfigError);
			expect((e as ConfigError).problems.map((p) => p.variable).sort()).toEqual([
				'POLEWISE_ROLE',
				'PORT'
			]);
			expect((e as Error).message.split('\n')).toHaveLength(2);
		}
	});

	it('an empty variable counts as unset', () => {
		expect(readConfig({ PORT: '', POLEWISE_ROLE: '' })).toMatchObject({ port: 3000, role: 'all' });
	});

	it('reads sizes the way the HTTP adapter does', () => {
		expect([
			parseByteSize('512K'),
			parseByteSize('6M'),
			parseByteSize('1G'),
			parseByteSize('100')
		]).toEqual([512 * 1024, 6 * MiB, 1024 * MiB, 100]);
		expect(parseByteSize('6MB')).toBeNull();
	});

	it('every setting it reads is in the README', async () => {
		const { readFileSync } = await import('node:fs');
		const readme = readFileSync(new URL('../../../../README.md', import.meta.url), 'utf8');
		const missing = SETTINGS.filter((name) => !readme.includes(`\`${name}\``));
		expect(missing).toEqual([]);
	});
});
