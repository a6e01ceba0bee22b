// Ids arrive in paths, query strings and bodies. PostgreSQL refuses a malformed UUID with an
// error, which used to surface as a 500; every id is checked at the edge instead, and a bad
// one is a 400 that names the parameter. The pattern is the one the `[id=uuid]` matcher uses
// (any RFC 4122 layout), so what a path accepts and what a body accepts agree.
import { ApiProblem } from './respond';

export const UUID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const isUuid = (value: unknown): value is string =>
	typeof value === 'string' && UUID_PATTERN.test(value);

/** What was sent, short enough to quote back. */
const quote = (value: string) =>
	JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);

export function badId(name: string, value: string, where: 'path' | 'query' | 'body'): ApiProblem {
	return new ApiProblem(
		400,
		`${name}: ${quote(value)} is not an id (ids are UUIDs like 3f2b8c1e-…); ${where} parameter "${name}"`,
		{
			code: 'bad_id',
			issues: [{ field: name, message: 'not an id (a UUID)' }]
		}
	);
}

/** The value when it is a UUID; a 400 naming `name` otherwise. */
export function requireId(value: string, name: string, where: 'path' | 'query' | 'body'): string {
	if (!isUuid(value)) throw badId(name, value, where);
	return value;
}
