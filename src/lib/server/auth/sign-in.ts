// Sign-up, sign-in and sign-out as plain functions: the form actions call them, and the
// integration tests call them against the real database.
import { recordAudit } from '../audit';
import { createUser, EmailTaken, findUserByEmail, findUserWithHashByEmail } from '../db/users';
import { createSignUpRequest, SIGN_UP_LIFETIME_MINUTES, takeSignUpRequest } from '../db/sign-ups';
import { sendMail, signUpConfirmMail, signUpExistingMail } from '../mail';
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

export const SIGN_UP_SENT = (email: string) =>
	`Check your inbox: we have sent a message to ${email}. Open the link in it to finish — it works once, for ${SIGN_UP_LIFETIME_MINUTES} minutes.`;

export type SignUpOutcome = { ok: true; message: string } | { ok: false; message: string };

/**
 * The sign-up form. It answers the same whether or not the address has an account, so it
 * cannot be used to find out who has one (sign-in and reset already answer alike): a new
 * address gets a link that finishes the account; an address with an account gets a note to
 * its owner instead. The password is hashed either way, and the mail is not awaited, so the
 * answer's timing does not tell either. Only the rate limits can refuse.
 */
export async function signUp(input: { email: string; name: string; password: string; next?: string | null }, ip: string, origin: string): Promise<SignUpOutcome> {
	const limited = await firstLimited([
		[RULES.signUpAddress, ip],
		[RULES.signUpAccount, input.email]
	]);
	if (limited) return { ok: false, message: `Too many sign-ups from this network or for this address. ${waitMessage(limited.retryAfterSeconds)}` };
	await hitLimit(RULES.signUpAddress, ip);
	await hitLimit(RULES.signUpAccount, input.email);
	const passwordHash = await hashPassword(input.password);
	const owner = await findUserByEmail(input.email);
	let mail;
	if (owner) {
		mail = { to: owner.email, ...signUpExistingMail({ name: owner.name, signInUrl: `${origin}/sign-in`, resetUrl: `${origin}/forgot-password` }) };
		await recordAudit({ type: 'sign_up_existing', actorId: owner.id, ip });
	} else {
		const { token } = await createSignUpRequest({ email: input.email, name: input.name, passwordHash, next: input.next ?? null });
		mail = { to: input.email, ...signUpConfirmMail({ name: input.name, url: `${origin}/sign-up/${token}`, expiresMinutes: SIGN_UP_LIFETIME_MINUTES }) };
	}
	sendMail(mail).catch((e) => console.error('[mail] sign-up message not sent:', e));
	return { ok: true, message: SIGN_UP_SENT(input.email.trim()) };
}

export type ConfirmOutcome =
	| { ok: true; user: SessionUser; token: string; session: SessionInfo; next: string | null }
	| { ok: false; state: 'unknown' | 'expired' | 'taken' };

/** The mailed link, used: the account is made and signed in, once. */
export async function confirmSignUp(linkToken: string, ip: string): Promise<ConfirmOutcome> {
	const link = await takeSignUpRequest(linkToken);
	if (link.state !== 'valid') return { ok: false, state: link.state };
	const { email, name, passwordHash, next } = link.request;
	try {
		const user = await createUser({ email, name, passwordHash });
		const { token, session } = await createSession(user.id);
		await recordAudit({ type: 'sign_in', actorId: user.id, detail: { via: 'sign_up' }, ip });
		return { ok: true, user: { id: user.id, email: user.email, name: user.name }, token, session, next };
	} catch (e) {
		// Someone finished an account for this address in between (another link, an older one).
		if (e instanceof EmailTaken) return { ok: false, state: 'taken' };
		throw e;
	}
}

export async function signOut(userId: string, sessionId: string, ip: string, everywhere = false): Promise<void> {
	if (everywhere) await invalidateUserSessions(userId);
	else await invalidateSession(sessionId);
	await recordAudit({ type: 'sign_out', actorId: userId, detail: everywhere ? { everywhere: true } : {}, ip });
}
