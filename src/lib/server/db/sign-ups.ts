// Pending sign-ups (see migration 0007): made by the sign-up form, turned into an account by
// the mailed link. Only the SHA-256 of the link's token is stored.
import { QueryTypes } from 'sequelize';
import { hashSecret, randomSecret } from '../auth/secrets';
import { db } from './connection';
import { normalizeEmail } from './users';

export const SIGN_UP_LIFETIME_MINUTES = 60;

export interface PendingSignUp {
	email: string;
	name: string;
	passwordHash: string;
	next: string | null;
}

/** Store a pending sign-up; the token for the link is returned once. */
export async function createSignUpRequest(input: PendingSignUp): Promise<{ token: string }> {
	const token = randomSecret(32);
	await db().query(
		`INSERT INTO sign_up_requests (id, email, name, password_hash, next, expires_at, created_at)
		 VALUES (:id, :email, :name, :hash, :next, now() + make_interval(mins => :minutes), now())`,
		{
			replacements: {
				id: hashSecret(token),
				email: normalizeEmail(input.email),
				name: input.name,
				hash: input.passwordHash,
				next: input.next,
				minutes: SIGN_UP_LIFETIME_MINUTES
			}
		}
	);
	if (Math.random() < 0.05)
		void db()
			.query(`DELETE FROM sign_up_requests WHERE expires_at < now() - interval '1 day'`)
			.catch(() => undefined);
	return { token };
}

export type SignUpLink =
	{ state: 'valid'; request: PendingSignUp } | { state: 'expired' | 'unknown' };

const columns = `email, name, password_hash AS "passwordHash", next, expires_at > now() AS live`;

/** What the link stands for, without using it. */
export async function findSignUpRequest(token: string): Promise<SignUpLink> {
	const [row] = await db().query<PendingSignUp & { live: boolean }>(
		`SELECT ${columns} FROM sign_up_requests WHERE id = :id`,
		{
			replacements: { id: hashSecret(token) },
			type: QueryTypes.SELECT
		}
	);
	if (!row) return { state: 'unknown' };
	if (!row.live) return { state: 'expired' };
	const { live: _live, ...request } = row;
	return { state: 'valid', request };
}

/**
 * Use the link: delete it and every other pending sign-up for the same address in one
 * statement (so two clicks cannot both create), returning what it held.
 */
export async function takeSignUpRequest(token: string): Promise<SignUpLink> {
	const found = await findSignUpRequest(token);
	if (found.state !== 'valid') return found;
	const [rows] = await db().query(
		`DELETE FROM sign_up_requests WHERE email = (SELECT email FROM sign_up_requests WHERE id = :id AND expires_at > now()) RETURNING id`,
		{ replacements: { id: hashSecret(token) } }
	);
	const taken = (rows as { id: string }[]).some((r) => r.id === hashSecret(token));
	return taken ? found : { state: 'unknown' };
}
