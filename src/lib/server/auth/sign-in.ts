// Sign-up, sign-in and sign-out as plain functions: the form actions call them, and the
// integration tests call them against the real database.
import { recordAudit } from '../audit';
import { createUser, EmailTaken, findUserWithHashByEmail } from '../db/users';
import { clearLimit, firstLimited, hitLimit, RULES, waitMessage } from '../rate-limit';
import { hashPassword, verifyPassword } from './password';
import { createSession, invalidateSession, invalidateUserSessions, type SessionInfo, type SessionUser } from './session';

export const SIGN_IN_FAILED = 'That e-mail address and password do not match an account.';

export type SignInOutcome =
	| { ok: true; user: SessionUser; token: string; session: SessionInfo }
	| { ok: false; reason: 'invalid'; message: string }
	| { ok: false; reason: 'limited'; message: string; retryAfterSeconds: number };

// Verifying against a real hash when no account matches keeps the answer time the same, so
// timing does not tell which addresses have accounts.
let decoy: Promise<string> | null = null;
const decoyHash = () => (decoy ??= hashPassword('polewise-decoy-password'));

export async function signIn(email: string, password: string, ip: string): Promise<SignInOutcome> {
	const limited = await firstLimited([
		[RULES.signInAccount, email],
		[RULES.signInAddress, ip]
	]);
	if (limited) {
		const message = `Too many failed sign-ins. ${waitMessage(limited.retryAfterSeconds)}`;
		return { ok: false, reason: 'limited', message, retryAfterSeconds: limited.retryAfterSeconds };
	}
	const user = await findUserWithHashByEmail(email);
	const valid = user?.passwordHash ? await verifyPassword(user.passwordHash, password) : (await verifyPassword(await decoyHash(), password), false);
	if (!user || !valid) {
		await hitLimit(RULES.signInAccount, email);
		await hitLimit(RULES.signInAddress, ip);
		await recordAudit({ type: 'sign_in_failed', actorId: user?.id ?? null, detail: { email }, ip });
		return { ok: false, reason: 'invalid', message: SIGN_IN_FAILED };
	}
	await clearLimit(RULES.signInAccount, email);
	const { token, session } = await createSession(user.id);
	await recordAudit({ type: 'sign_in', actorId: user.id, ip });
	return { ok: true, user: { id: user.id, email: user.email, name: user.name }, token, session };
}

export type SignUpOutcome =
	| { ok: true; user: SessionUser; token: string; session: SessionInfo }
	| { ok: false; field: 'email' | 'form'; message: string };

export async function signUp(input: { email: string; name: string; password: string }, ip: string): Promise<SignUpOutcome> {
	const limited = await firstLimited([[RULES.signUpAddress, ip]]);
	if (limited) return { ok: false, field: 'form', message: `Too many new accounts from this network. ${waitMessage(limited.retryAfterSeconds)}` };
	await hitLimit(RULES.signUpAddress, ip);
	try {
		const user = await createUser({ email: input.email, name: input.name, passwordHash: await hashPassword(input.password) });
		const { token, session } = await createSession(user.id);
		await recordAudit({ type: 'sign_in', actorId: user.id, detail: { via: 'sign_up' }, ip });
		return { ok: true, user: { id: user.id, email: user.email, name: user.name }, token, session };
	} catch (e) {
		if (e instanceof EmailTaken) return { ok: false, field: 'email', message: 'An account with this e-mail address already exists. Sign in instead, or reset its password.' };
		throw e;
	}
}

export async function signOut(userId: string, sessionId: string, ip: string, everywhere = false): Promise<void> {
	if (everywhere) await invalidateUserSessions(userId);
	else await invalidateSession(sessionId);
	await recordAudit({ type: 'sign_out', actorId: userId, detail: everywhere ? { everywhere: true } : {}, ip });
}
