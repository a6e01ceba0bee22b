// Changing a password (signed in) and resetting it through an e-mailed link (signed out).
// Either way every session of the account ends; the changing browser gets a fresh one.
import { recordAudit } from '../audit';
import { findUserByEmail, getPasswordHash, getUser, setPasswordHash } from '../db/users';
import { checkPasswordReset, createPasswordReset, RESET_LIFETIME_MINUTES, resetPasswordWithToken, type ResetState } from '../db/tokens';
import { passwordResetMail, sendMail } from '../mail';
import { firstLimited, hitLimit, RULES, waitMessage } from '../rate-limit';
import { hashPassword, verifyPassword } from './password';
import { createSession, invalidateUserSessions, type SessionInfo } from './session';

export type ChangeOutcome = { ok: true; token: string; session: SessionInfo } | { ok: false; field: 'current'; message: string };

export async function changePassword(userId: string, current: string, next: string, ip: string): Promise<ChangeOutcome> {
	const stored = await getPasswordHash(userId);
	if (!stored || !(await verifyPassword(stored, current))) return { ok: false, field: 'current', message: 'That is not your current password.' };
	await setPasswordHash(userId, await hashPassword(next));
	await invalidateUserSessions(userId);
	const { token, session } = await createSession(userId);
	await recordAudit({ type: 'password_changed', actorId: userId, ip });
	return { ok: true, token, session };
}

export const RESET_SENT =
	'If an account uses that address, we have sent it a link to choose a new password. The link works once, for 30 minutes.';

/**
 * Ask for a reset link. The answer is the same whether or not the address has an account;
 * only the rate limit (counted per address typed, known or not) can refuse.
 */
export async function requestPasswordReset(email: string, ip: string, origin: string): Promise<{ ok: true } | { ok: false; message: string }> {
	const limited = await firstLimited([
		[RULES.resetAccount, email],
		[RULES.resetAddress, ip]
	]);
	if (limited) return { ok: false, message: `Too many reset requests. ${waitMessage(limited.retryAfterSeconds)}` };
	await hitLimit(RULES.resetAccount, email);
	await hitLimit(RULES.resetAddress, ip);
	const user = await findUserByEmail(email);
	if (user) {
		const { token } = await createPasswordReset(user.id);
		const mail = passwordResetMail({ name: user.name, url: `${origin}/reset-password/${token}`, expiresMinutes: RESET_LIFETIME_MINUTES });
		// Not awaited: waiting for SMTP only when an account exists would let timing tell.
		sendMail({ to: user.email, ...mail }).catch((e) => console.error('[mail] password reset not sent:', e));
	}
	return { ok: true };
}

export async function resetEmailFor(token: string): Promise<{ state: ResetState['state']; email?: string }> {
	const found = await checkPasswordReset(token);
	if (found.state !== 'valid') return { state: found.state };
	return { state: 'valid', email: (await getUser(found.userId))?.email };
}

export async function resetPassword(token: string, password: string, ip: string): Promise<ResetState> {
	const outcome = await resetPasswordWithToken(token, await hashPassword(password));
	if (outcome.state === 'valid') await recordAudit({ type: 'password_reset', actorId: outcome.userId, ip });
	return outcome;
}
