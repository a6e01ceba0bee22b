// Per-sheet sharing: a guest invited by e-mail sees that one sheet and nothing else of the
// workspace; grants follow the stronger of default and grant; read-only links are unguessable,
// open without an account and stop working when revoked.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld, person } from './support/fixtures';
import { inboxFor } from './support/auth-helpers';
import { updateWorkspace } from '../../src/lib/server/db/workspaces';
import { TOKEN_PATTERN } from '../../src/lib/server/sharing/secret-token';
import * as grants from '../../src/routes/api/sheets/[id=uuid]/grants/+server';
import * as grant from '../../src/routes/api/sheets/[id=uuid]/grants/[userId=uuid]/+server';
import * as accept from '../../src/routes/api/invitations/[token=token]/accept/+server';
import * as guestSheets from '../../src/routes/api/sheets/+server';
import * as sheetRoute from '../../src/routes/api/sheets/[id=uuid]/+server';
import * as workspaceSheets from '../../src/routes/api/workspaces/[id=uuid]/sheets/+server';
import * as links from '../../src/routes/api/sheets/[id=uuid]/links/+server';
import * as link from '../../src/routes/api/sheets/[id=uuid]/links/[linkId=uuid]/+server';
import * as shared from '../../src/routes/api/shared/[token=token]/+server';

useDatabase();

describe('guests', () => {
	it('sharing with an address without an account invites a guest who then sees only that sheet', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet('Shared divider');
		const { sheet: other } = await world.sheet('Private TIA');
		const email = `guest-${crypto.randomUUID().slice(0, 8)}@example.test`;
		const shared = await call(grants.POST, { user: world.owner, params: { id: sheet.id }, method: 'POST', body: { email, role: 'commenter' } });
		expect(shared.status).toBe(201);
		expect(shared.body.outcome).toBe('invited');
		const [mail] = await inboxFor(email);
		expect(mail.subject).toContain('Shared divider');
		const token = /\/invitations\/([a-z2-7]{52})/.exec(mail.text)![1];
		// They sign up with the invited address afterwards.
		const guest = await person('Later guest', email);
		expect((await call(accept.POST, { user: guest, params: { token }, method: 'POST' })).status).toBe(200);
		const read = await call(sheetRoute.GET, { user: guest, params: { id: sheet.id } });
		expect(read.status).toBe(200);
		expect(read.body).toMatchObject({ role: 'commenter', canEdit: false });
		expect((await call(sheetRoute.GET, { user: guest, params: { id: other.id } })).status).toBe(404);
		expect((await call(workspaceSheets.GET, { user: guest, params: { id: world.workspace.id } })).status).toBe(404);
		const mine = await call(guestSheets.GET, { user: guest });
		expect(mine.body.sheets.map((s: { name: string }) => s.name)).toEqual(['Shared divider']);
	});

	it('sharing with an existing account grants at once; the stronger of grant and default wins; withdrawing ends it', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const stranger = await person('Stranger');
		const shared = await call(grants.POST, { user: world.editor, params: { id: sheet.id }, method: 'POST', body: { email: stranger.email, role: 'viewer' } });
		expect(shared.body.outcome).toBe('granted');
		expect((await inboxFor(stranger.email))[0].text).toContain(`/sheets/${sheet.id}`);
		expect((await call(sheetRoute.GET, { user: stranger, params: { id: sheet.id } })).body.role).toBe('viewer');
		// The member has a viewer grant; raising the workspace default to editor raises them too.
		await updateWorkspace(world.workspace.id, { defaultSheetRole: 'editor' });
		expect((await call(sheetRoute.GET, { user: world.viewer, params: { id: sheet.id } })).body.role).toBe('editor');
		expect((await call(grant.DELETE, { user: world.owner, params: { id: sheet.id, userId: stranger.id }, method: 'DELETE' })).status).toBe(204);
		expect((await call(sheetRoute.GET, { user: stranger, params: { id: sheet.id } })).status).toBe(404);
		const listed = await call(grants.GET, { user: world.owner, params: { id: sheet.id } });
		expect(listed.body.grants.find((g: { name: string }) => g.name === 'Guest')).toMatchObject({ member: false, role: 'editor' });
	});
});

describe('read-only links', () => {
	it('a link token is 256-bit base32, shown once, opens the sheet without an account, and dies when revoked', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const made = await call(links.POST, { user: world.owner, params: { id: sheet.id }, method: 'POST', body: { label: 'Review board' } });
		expect(made.status).toBe(201);
		expect(made.body.token).toMatch(TOKEN_PATTERN); // 52 base32 characters = 260 bits ≥ 256 random bits
		expect(made.body.url).toMatch(new RegExp(`/shared/${made.body.token}$`));
		const listed = await call(links.GET, { user: world.owner, params: { id: sheet.id } });
		expect(JSON.stringify(listed.body)).not.toContain(made.body.token);
		const open = await call(shared.GET, { params: { token: made.body.token } });
		expect(open.status).toBe(200);
		expect(open.body.revision.number).toBe(1);
		const nearMiss = made.body.token.slice(0, -1) + (made.body.token.endsWith('a') ? 'b' : 'a');
		expect((await call(shared.GET, { params: { token: nearMiss } })).status).toBe(404);
		expect((await call(link.DELETE, { user: world.owner, params: { id: sheet.id, linkId: made.body.link.id }, method: 'DELETE' })).status).toBe(204);
		expect((await call(shared.GET, { params: { token: made.body.token } })).status).toBe(404);
	});
});
