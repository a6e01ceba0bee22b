// Personal API tokens and password-reset links. Both are random secrets shown to their owner
// once (the token on the account page, the link in an e-mail) and stored as SHA-256 hex.
import { Op } from 'sequelize';
import { db } from './connection';
import { models } from './models';
import { hashSecret, randomSecret } from '../auth/secrets';

export const API_TOKEN_PREFIX = 'pw_';
export const RESET_LIFETIME_MINUTES = 30;
/** last_used_at is written at most this often per token, so API traffic is not a write each. */
const TOUCH_EVERY_MS = 60_000;

export interface ApiTokenInfo {
	id: string;
	name: string;
	prefix: string;
	createdAt: Date;
	lastUsedAt: Date | null;
}

export async function createApiToken(userId: string, name: string): Promise<{ token: string; info: ApiTokenInfo }> {
	const token = API_TOKEN_PREFIX + randomSecret();
	const row = await models().ApiToken.create({ userId, name, tokenHash: hashSecret(token), prefix: token.slice(0, 9) });
	return { token, info: { id: row.id, name: row.name, prefix: row.prefix, createdAt: row.createdAt, lastUsedAt: null } };
}

export async function listApiTokens(userId: string): Promise<ApiTokenInfo[]> {
	const rows = await models().ApiToken.findAll({ where: { userId, revokedAt: null }, order: [['createdAt', 'DESC']] });
	return rows.map((r) => ({ id: r.id, name: r.name, prefix: r.prefix, createdAt: r.createdAt, lastUsedAt: r.lastUsedAt ?? null }));
}

/** Revoke one of the user's own tokens; returns its name, or null when it is not theirs. */
export async function revokeApiToken(userId: string, tokenId: string): Promise<string | null> {
	const row = await models().ApiToken.findOne({ where: { id: tokenId, userId, revokedAt: null } });
	if (!row) return null;
	row.revokedAt = new Date();
	await row.save();
	return row.name;
}

/** The owner of a live token, recording when it was last used. */
export async function userForApiToken(token: string): Promise<{ id: string; email: string; name: string } | null> {
	if (!token.startsWith(API_TOKEN_PREFIX) || token.length > 80) return null;
	const { ApiToken, User } = models();
	const row = await ApiToken.findOne({
		where: { tokenHash: hashSecret(token), revokedAt: null },
		include: [{ model: User, as: 'user', attributes: ['id', 'email', 'name'] }]
	});
	const user = row && (row as unknown as { user: { id: string; email: string; name: string } | null }).user;
	if (!row || !user) return null;
	const now = Date.now();
	if (!row.lastUsedAt || now - row.lastUsedAt.getTime() > TOUCH_EVERY_MS) {
		await ApiToken.update({ lastUsedAt: new Date(now) }, { where: { id: row.id } });
	}
	return { id: user.id, email: user.email, name: user.name };
}

/** A new reset link for the user; older unused links stop working (only the newest counts). */
export async function createPasswordReset(userId: string): Promise<{ token: string; expiresAt: Date }> {
	const { PasswordReset } = models();
	const token = randomSecret();
	const expiresAt = new Date(Date.now() + RESET_LIFETIME_MINUTES * 60_000);
	await db().transaction(async (transaction) => {
		await PasswordReset.destroy({ where: { userId, usedAt: null }, transaction });
		await PasswordReset.create({ id: hashSecret(token), userId, expiresAt }, { transaction });
	});
	return { token, expiresAt };
}

export type ResetState = { state: 'valid'; userId: string; expiresAt: Date } | { state: 'used' } | { state: 'expired' } | { state: 'unknown' };

export async function checkPasswordReset(token: string): Promise<ResetState> {
	if (!token || token.length > 64) return { state: 'unknown' };
	const row = await models().PasswordReset.findByPk(hashSecret(token));
	if (!row) return { state: 'unknown' };
	if (row.usedAt) return { state: 'used' };
	if (row.expiresAt.getTime() <= Date.now()) return { state: 'expired' };
	return { state: 'valid', userId: row.userId, expiresAt: row.expiresAt };
}

/**
 * Use a reset link: mark it used, store the new hash and end every session of the account, in
 * one transaction. The conditional UPDATE is what makes the link single-use even when two
 * requests race; the hash is computed by the caller beforehand (argon2 is slow on purpose).
 */
export async function resetPasswordWithToken(token: string, passwordHash: string): Promise<ResetState> {
	const { PasswordReset, User, Session } = models();
	const outcome = await db().transaction(async (transaction) => {
		const [count, rows] = await PasswordReset.update(
			{ usedAt: new Date() },
			{ where: { id: hashSecret(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } }, returning: true, transaction }
		);
		if (count === 0) return null;
		const { userId, expiresAt } = rows[0];
		await User.update({ passwordHash }, { where: { id: userId }, transaction });
		await Session.destroy({ where: { userId }, transaction });
		return { state: 'valid', userId, expiresAt } as const;
	});
	return outcome ?? checkPasswordReset(token);
}
