// Every authorization decision in Polewise is made here. `decide` is a pure function of who is
// asking (a signed-in user, the holder of a read-only link, or nobody), what they want to do and
// what they are to the target; the resolvers below load that relationship from the database and
// throw an AccessDenied carrying the HTTP status a route should answer with.
//
// Status policy: nobody → 401; a workspace or sheet the caller cannot see at all → 404 (never
// reveal that it exists); visible but not allowed → 403; a change to a trashed sheet → 409.
import { getSheet, type SheetRecord } from './db/sheets';
import { getMembership, getWorkspace, type WorkspaceRecord } from './db/workspaces';
import { getGrant } from './db/grants';
import type { WorkspaceRole } from './db/models/membership';
import type { SheetRole } from './db/models/workspace';

export type { WorkspaceRole, SheetRole };

export type Actor = { kind: 'user'; id: string } | { kind: 'link'; sheetId: string } | { kind: 'nobody' };

export const SHEET_ACTIONS = ['read', 'save', 'rename', 'duplicate', 'trash', 'restore', 'delete', 'share', 'comment', 'analyze'] as const;
export const WORKSPACE_ACTIONS = ['list', 'create_sheet', 'leave', 'manage_members', 'manage_workspace', 'read_audit', 'transfer_ownership'] as const;
export type SheetAction = (typeof SHEET_ACTIONS)[number];
export type WorkspaceAction = (typeof WORKSPACE_ACTIONS)[number];
export type Action = SheetAction | WorkspaceAction;

/** The caller's effective standing on a sheet, strongest first. `link` is a read-only link. */
export type EffectiveRole = 'owner' | 'admin' | 'editor' | 'commenter' | 'viewer' | 'link';

export interface WorkspaceTarget {
	kind: 'workspace';
	workspaceRole: WorkspaceRole | null;
}

export interface SheetTarget {
	kind: 'sheet';
	sheetId: string;
	workspaceRole: WorkspaceRole | null;
	defaultSheetRole: SheetRole;
	grantRole: SheetRole | null;
	trashed: boolean;
}

export type Target = WorkspaceTarget | SheetTarget;
export type Decision = { allowed: true } | { allowed: false; status: 401 | 403 | 404 | 409; message: string };

const LEVEL: Record<EffectiveRole, number> = { link: 1, viewer: 1, commenter: 2, editor: 3, admin: 4, owner: 4 };
const SHEET_NEEDS: Record<SheetAction, number> = {
	read: 1, analyze: 1, duplicate: 1, comment: 2, save: 3, rename: 3, trash: 3, restore: 3, share: 3, delete: 4
};
const WORKSPACE_NEEDS: Record<WorkspaceAction, WorkspaceRole[]> = {
	list: ['owner', 'admin', 'member'],
	create_sheet: ['owner', 'admin', 'member'],
	leave: ['owner', 'admin', 'member'],
	manage_members: ['owner', 'admin'],
	manage_workspace: ['owner', 'admin'],
	read_audit: ['owner', 'admin'],
	transfer_ownership: ['owner']
};
// Changes that make no sense on a sheet in the trash; restore it first.
const BLOCKED_IN_TRASH: SheetAction[] = ['save', 'rename', 'duplicate', 'share', 'comment'];
// Only workspace members may do these even with an editor grant: a guest sees one sheet only.
const MEMBERS_ONLY: SheetAction[] = ['duplicate', 'share', 'trash', 'restore'];

const deny = (status: 401 | 403 | 404 | 409, message: string): Decision => ({ allowed: false, status, message });
const NOT_FOUND = deny(404, 'Not found.');

const isSheetAction = (action: Action): action is SheetAction => (SHEET_ACTIONS as readonly string[]).includes(action);

/** The strongest role the actor holds on a sheet, or null when the sheet is invisible to them. */
export function effectiveRole(actor: Actor, target: SheetTarget): EffectiveRole | null {
	if (actor.kind === 'nobody') return null;
	if (actor.kind === 'link') return actor.sheetId === target.sheetId && !target.trashed ? 'link' : null;
	if (target.workspaceRole === 'owner' || target.workspaceRole === 'admin') return target.workspaceRole;
	const roles = [target.grantRole, target.workspaceRole === 'member' ? target.defaultSheetRole : null].filter(
		(r): r is SheetRole => r !== null
	);
	if (roles.length === 0) return null;
	// A guest's sheet in the trash disappears for them; members still find it in the trash.
	if (target.trashed && target.workspaceRole === null) return null;
	return roles.reduce((a, b) => (LEVEL[b] > LEVEL[a] ? b : a));
}

export function decide(actor: Actor, action: Action, target: Target): Decision {
	if (actor.kind === 'nobody') return deny(401, 'Sign in first.');
	if (target.kind === 'workspace') {
		if (isSheetAction(action)) throw new Error(`"${action}" is a sheet action`);
		if (actor.kind === 'link') return deny(401, 'A read-only link opens one sheet; sign in to see the workspace.');
		if (!target.workspaceRole) return NOT_FOUND;
		return WORKSPACE_NEEDS[action].includes(target.workspaceRole)
			? { allowed: true }
			: deny(403, `Your role (${target.workspaceRole}) may not do this in the workspace.`);
	}
	if (!isSheetAction(action)) {
		// "list" against a sheet asks about its workspace: guests and link holders cannot see it.
		if (actor.kind === 'link') return deny(403, 'A read-only link opens this sheet only.');
		return target.workspaceRole ? decide(actor, action, { kind: 'workspace', workspaceRole: target.workspaceRole }) : NOT_FOUND;
	}
	const role = effectiveRole(actor, target);
	if (!role) return NOT_FOUND;
	if (role === 'link' && LEVEL.link < SHEET_NEEDS[action]) return deny(403, 'A read-only link can only view this sheet.');
	if (role === 'link' && action === 'duplicate') return deny(403, 'A read-only link can only view this sheet.');
	if (target.trashed && BLOCKED_IN_TRASH.includes(action)) return deny(409, 'The sheet is in the trash; restore it first.');
	if (LEVEL[role] < SHEET_NEEDS[action]) return deny(403, `Your role on this sheet (${role}) may not ${action} it.`);
	if (MEMBERS_ONLY.includes(action) && !target.workspaceRole) return deny(403, `Only members of the workspace may ${action} this sheet.`);
	return { allowed: true };
}

export function can(actor: Actor, action: Action, target: Target): boolean {
	return decide(actor, action, target).allowed;
}

export class AccessDenied extends Error {
	constructor(
		readonly status: 401 | 403 | 404 | 409,
		message: string
	) {
		super(message);
	}
}

export function actorOf(locals: { user?: { id: string } | null }): Actor {
	return locals.user ? { kind: 'user', id: locals.user.id } : { kind: 'nobody' };
}

export interface SheetAccess {
	sheet: SheetRecord;
	workspace: WorkspaceRecord;
	target: SheetTarget;
	role: EffectiveRole;
	can: (action: Action) => boolean;
}

export interface WorkspaceAccess {
	workspace: WorkspaceRecord;
	role: WorkspaceRole;
	can: (action: WorkspaceAction) => boolean;
}

function enforce(decision: Decision) {
	if (!decision.allowed) throw new AccessDenied(decision.status, decision.message);
}

/** Load a sheet with the caller's standing and check `action`; throws AccessDenied otherwise. */
export async function authorizeSheet(actor: Actor, sheetId: string, action: SheetAction | 'list'): Promise<SheetAccess> {
	if (actor.kind === 'nobody') throw new AccessDenied(401, 'Sign in first.');
	const sheet = await getSheet(sheetId);
	const workspace = sheet && (await getWorkspace(sheet.workspaceId));
	if (!sheet || !workspace) throw new AccessDenied(404, 'Not found.');
	const userId = actor.kind === 'user' ? actor.id : null;
	const [membership, grant] = userId ? await Promise.all([getMembership(workspace.id, userId), getGrant(sheet.id, userId)]) : [null, null];
	const target: SheetTarget = {
		kind: 'sheet',
		sheetId: sheet.id,
		workspaceRole: membership?.role ?? null,
		defaultSheetRole: workspace.defaultSheetRole,
		grantRole: grant?.role ?? null,
		trashed: sheet.trashedAt !== null
	};
	enforce(decide(actor, action, target));
	const role = effectiveRole(actor, target)!;
	return { sheet, workspace, target, role, can: (a) => can(actor, a, target) };
}

/** Load a workspace with the caller's role and check `action`; throws AccessDenied otherwise. */
export async function authorizeWorkspace(actor: Actor, workspaceId: string, action: WorkspaceAction): Promise<WorkspaceAccess> {
	if (actor.kind === 'nobody') throw new AccessDenied(401, 'Sign in first.');
	if (actor.kind === 'link') throw new AccessDenied(401, 'A read-only link opens one sheet; sign in to see the workspace.');
	const workspace = await getWorkspace(workspaceId);
	const membership = workspace && (await getMembership(workspace.id, actor.id));
	const target: WorkspaceTarget = { kind: 'workspace', workspaceRole: membership?.role ?? null };
	enforce(decide(actor, action, target));
	return { workspace: workspace!, role: membership!.role, can: (a) => can(actor, a, target) };
}
