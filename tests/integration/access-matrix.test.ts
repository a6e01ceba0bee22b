// The role × action matrix: every standing a caller can have against every action, through the
// JSON API handlers on real PostgreSQL (comment, and the link holder's changes, through the
// access module: there is no comment route yet, and a link carries no session to call the
// change routes with — without one they answer 401, the signed-out row).
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld, network } from './support/fixtures';
import { AccessDenied, authorizeSheet, type Actor } from '../../src/lib/server/access';
import { trashSheet } from '../../src/lib/server/db/sheets';
import * as sheetsOfWorkspace from '../../src/routes/api/workspaces/[id=uuid]/sheets/+server';
import * as sheetRoute from '../../src/routes/api/sheets/[id=uuid]/+server';
import * as revisionsRoute from '../../src/routes/api/sheets/[id=uuid]/revisions/+server';
import * as linksRoute from '../../src/routes/api/sheets/[id=uuid]/links/+server';
import * as sharedRoute from '../../src/routes/api/shared/[token=token]/+server';
import * as analysisRoute from '../../src/routes/api/sheets/[id=uuid]/revisions/[n=revision]/analysis/+server';
import * as sharedAnalysisRoute from '../../src/routes/api/shared/[token=token]/analysis/+server';

useDatabase();

const ACTIONS = ['list', 'read', 'save', 'rename', 'trash', 'delete', 'share', 'comment', 'analyze'] as const;
type MatrixAction = (typeof ACTIONS)[number];
const ROLES = ['owner', 'admin', 'member', 'editor', 'commenter', 'viewer', 'guest', 'link', 'signedOut', 'outsider'] as const;
type Role = (typeof ROLES)[number];

const row = (...s: number[]) => Object.fromEntries(ACTIONS.map((a, i) => [a, s[i]])) as Record<MatrixAction, number>;
// Columns:               list read save rename trash delete share comment analyze
const EXPECTED: Record<Role, Record<MatrixAction, number>> = {
	owner: /*           */ row(200, 200, 201, 200, 200, 204, 201, 200, 200),
	admin: /*           */ row(200, 200, 201, 200, 200, 204, 201, 200, 200),
	// The workspace default sheet role is viewer in this world.
	member: /*          */ row(200, 200, 403, 403, 403, 403, 403, 403, 200),
	editor: /*          */ row(200, 200, 201, 200, 200, 403, 201, 200, 200),
	commenter: /*       */ row(200, 200, 403, 403, 403, 403, 403, 200, 200),
	viewer: /*          */ row(200, 200, 403, 403, 403, 403, 403, 403, 200),
	// An editor grant, but not a member: cannot see the workspace, trash or share; a trashed
	// sheet (the precondition of delete) disappears for them.
	guest: /*           */ row(404, 200, 201, 200, 403, 404, 403, 200, 200),
	// Read-only link: reads and analyses; the trashed sheet behind delete is gone for it too.
	link: /*            */ row(403, 200, 403, 403, 403, 404, 403, 403, 200),
	signedOut: /*       */ row(401, 401, 401, 401, 401, 401, 401, 401, 401),
	// Someone from another workspace: the sheet and workspace do not exist for them.
	outsider: /*        */ row(404, 404, 404, 404, 404, 404, 404, 404, 404)
};

async function statusOf(promise: Promise<unknown>): Promise<number> {
	try {
		await promise;
		return 200;
	} catch (e) {
		if (e instanceof AccessDenied) return e.status;
		throw e;
	}
}

type World = Awaited<ReturnType<typeof matrixWorld>>;

async function attempt(world: World, role: Role, action: MatrixAction): Promise<number> {
	const { sheet, token } = await world.sheet();
	if (action === 'delete') await trashSheet(world.owner.id, sheet.id);
	const id = sheet.id;
	if (role === 'link') {
		const actor: Actor = { kind: 'link', sheetId: id };
		if (action === 'read' || action === 'delete') return (await call(sharedRoute.GET, { params: { token } })).status;
		if (action === 'analyze') return (await call(sharedAnalysisRoute.GET, { params: { token } })).status;
		return statusOf(authorizeSheet(actor, id, action === 'list' ? 'list' : action));
	}
	const user = role === 'signedOut' ? null : world[role];
	const params = { id };
	switch (action) {
		case 'list':
			return (await call(sheetsOfWorkspace.GET, { user, params: { id: world.workspace.id } })).status;
		case 'read':
			return (await call(sheetRoute.GET, { user, params })).status;
		case 'save':
			return (await call(revisionsRoute.PUT, { user, params, method: 'PUT', body: { baseRevision: 1, document: network('10M') } })).status;
		case 'rename':
			return (await call(sheetRoute.PATCH, { user, params, method: 'PATCH', body: { name: 'Divider, trimmed' } })).status;
		case 'trash':
			return (await call(sheetRoute.DELETE, { user, params, method: 'DELETE' })).status;
		case 'delete':
			return (await call(sheetRoute.DELETE, { user, params, method: 'DELETE', path: `/api/sheets/${id}?permanent=1` })).status;
		case 'share':
			return (await call(linksRoute.POST, { user, params, method: 'POST', body: {} })).status;
		case 'comment':
			return statusOf(authorizeSheet(user ? { kind: 'user', id: user.id } : { kind: 'nobody' }, id, 'comment'));
		case 'analyze':
			return (await call(analysisRoute.GET, { user, params: { id, n: '1' } })).status;
	}
}

describe('role × action matrix (exact statuses through the API handlers)', () => {
	it.each(ROLES)('%s', async (role) => {
		const world = await matrixWorld();
		const seen: Record<string, number> = {};
		for (const action of ACTIONS) seen[action] = await attempt(world, role, action);
		expect(seen).toEqual(EXPECTED[role]);
	});
});
