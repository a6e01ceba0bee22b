// Security-relevant events, recorded by whoever performs them. Workspace events are read by
// the workspace's owners and admins; account events (no workspace) on the person's account page.
import { findAuditEvents, insertAuditEvent, type AuditRow } from './db/audit-events';

export const AUDIT_TYPES = [
	'sign_in',
	'sign_in_failed',
	'sign_up_existing',
	'sign_out',
	'password_changed',
	'password_reset',
	'role_changed',
	'member_removed',
	'ownership_transferred',
	'token_created',
	'token_revoked',
	'sheet_shared',
	'sheet_unshared',
	'sheet_deleted',
	'invitation_sent'
] as const;
export type AuditType = (typeof AUDIT_TYPES)[number];
export type { AuditRow };

export interface AuditInput {
	type: AuditType;
	/** Who did it; for `sign_in_failed` the account that was tried (null when none matched). */
	actorId: string | null;
	workspaceId?: string | null;
	sheetId?: string | null;
	/** Small facts worth keeping (names, roles, e-mail addresses); never secrets. */
	detail?: Record<string, unknown>;
	ip?: string | null;
}

export async function recordAudit(input: AuditInput): Promise<void> {
	await insertAuditEvent({
		type: input.type,
		actorId: input.actorId,
		workspaceId: input.workspaceId ?? null,
		sheetId: input.sheetId ?? null,
		detail: input.detail ?? {},
		ip: input.ip ? input.ip.slice(0, 45) : null
	});
}

/** A workspace's events, newest first; pass the last row's createdAt as `before` for the next page. */
export function listAudit({ workspaceId, limit, before }: { workspaceId: string; limit: number; before?: Date }): Promise<AuditRow[]> {
	return findAuditEvents({ workspaceId }, limit, before);
}

/** The person's own account events (sign-ins, password and token changes), newest first. */
export function listAccountAudit({ userId, limit, before }: { userId: string; limit: number; before?: Date }): Promise<AuditRow[]> {
	return findAuditEvents({ actorId: userId, workspaceId: null }, limit, before);
}
