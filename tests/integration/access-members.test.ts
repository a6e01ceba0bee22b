// Workspace membership through the JSON API: invitations by e-mail (read from the fake inbox),
// single use, revocation, expiry and the invited address; role changes, removal, ownership
// transfer and leaving, with the rules that keep a workspace owned.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { person } from './support/fixtures';
import { inboxFor } from './support/auth-helpers';
import { addMember, createWorkspace, getMembership } from '../../src/lib/server/db/workspaces';
import { acceptInvitation, createInvitation } from '../../src/lib/server/db/invitations';
import * as invitations from '../../src/routes/api/workspaces/[id=uuid]/invitations/+server';
import * as invitation from '../../src/routes/api/workspaces/[id=uuid]/invitations/[invitationId=uuid]/+server';
import * as accept from '../../src/routes/api/invitations/[token=token]/accept/+server';
import * as member from '../../src/routes/api/workspaces/[id=uuid]/members/[userId=uuid]/+server';
import * as transfer from '../../src/routes/api/workspaces/[id=uuid]/transfer/+server';
import * as leave from '../../src/routes/api/workspaces/[id=uuid]/leave/+server';
import * as audit from '../../src/routes/api/workspaces/[id=uuid]/audit/+server';

useDatabase();

const tokenIn = (text: string) => /\/invitations\/([a-z2-7]{52})/.exec(text)?.[1];

describe('invitations', () => {
	it('an invitation mails a link; the invited address accepts it once and joins with the offered role', async () => {
		const owner = await person('Owner');
		const ws = await createWorkspace(owner.id, 'Probe lab');
		const invitee = await person('Invitee');
		const sent = await call(invitations.POST, { user: owner, params: { id: ws.id }, method: 'POST', body: { email: invitee.email.toUpperCase(), role: 'admin' } });
		expect(sent.status).toBe(201);
		expect(sent.body.invitation).toMatchObject({ email: invitee.email, role: 'admin', status: 'pending' });
		const [mail] = await inboxFor(invitee.email);
		expect(mail.subject).toContain('Probe lab');
		const token = tokenIn(mail.text)!;
		expect(token).toBeTruthy();
		// Someone else signed in cannot use a forwarded link.
		const stranger = await person('Stranger');
		const wrong = await call(accept.POST, { user: stranger, params: { token }, method: 'POST' });
		expect(wrong.status).toBe(409);
		expect(wrong.body.error).toContain(invitee.email);
		expect((await call(accept.POST, { user: invitee, params: { token }, method: 'POST' })).status).toBe(200);
		expect(await getMembership(ws.id, invitee.id)).toEqual({ role: 'admin' });
		const again = await call(accept.POST, { user: invitee, params: { token }, method: 'POST' });
		expect(again.status).toBe(409);
		expect(again.body.error).toMatch(/accepted/);
		const listed = await call(invitations.GET, { user: owner, params: { id: ws.id } });
		expect(listed.body.invitations).toEqual([]);
		const events = await call(audit.GET, { user: owner, params: { id: ws.id } });
		expect(events.body.events.map((e: { type: string }) => e.type)).toContain('invitation_sent');
	});

	it('a revoked invitation and an expired one no longer let anyone in', async () => {
		const owner = await person('Owner');
		const ws = await createWorkspace(owner.id, 'Probe lab');
		const invitee = await person('Invitee');
		const sent = await call(invitations.POST, { user: owner, params: { id: ws.id }, method: 'POST', body: { email: invitee.email, role: 'member' } });
		const token = tokenIn((await inboxFor(invitee.email))[0].text)!;
		expect((await call(invitation.DELETE, { user: owner, params: { id: ws.id, invitationId: sent.body.invitation.id }, method: 'DELETE' })).status).toBe(204);
		expect((await call(accept.POST, { user: invitee, params: { token }, method: 'POST' })).body.error).toMatch(/revoked/);
		const old = await createInvitation({ workspaceId: ws.id, email: invitee.email, role: 'member', invitedBy: owner.id, now: new Date(Date.now() - 8 * 86_400_000) });
		await expect(acceptInvitation(old.token, invitee)).rejects.toThrow(/expired/);
		expect(await getMembership(ws.id, invitee.id)).toBeNull();
	});

	it('a member cannot invite (403); an outsider cannot see the invitations (404); a bad address is 400 naming the field', async () => {
		const owner = await person('Owner');
		const plain = await person('Plain');
		const outsider = await person('Outsider');
		const ws = await createWorkspace(owner.id, 'Probe lab');
		await addMember(ws.id, plain.id, 'member');
		const body = { email: 'new@example.test', role: 'member' };
		expect((await call(invitations.POST, { user: plain, params: { id: ws.id }, method: 'POST', body })).status).toBe(403);
		expect((await call(invitations.GET, { user: outsider, params: { id: ws.id } })).status).toBe(404);
		const bad = await call(invitations.POST, { user: owner, params: { id: ws.id }, method: 'POST', body: { email: 'not-an-address', role: 'member' } });
		expect(bad.status).toBe(400);
		expect(bad.body.issues[0]).toEqual({ field: 'email', message: 'Enter a valid e-mail address, like name@example.com' });
		const role = await call(invitations.POST, { user: owner, params: { id: ws.id }, method: 'POST', body: { email: 'x@example.test', role: 'owner' } });
		expect(role.body.error).toBe('role: Role must be admin or member');
	});
});

describe('members and ownership', () => {
	async function team() {
		const [owner, admin, plain] = [await person('Owner'), await person('Admin'), await person('Plain')];
		const ws = await createWorkspace(owner.id, 'Probe lab');
		await addMember(ws.id, admin.id, 'admin');
		await addMember(ws.id, plain.id, 'member');
		return { owner, admin, plain, ws };
	}

	it('admins change roles and remove members but cannot touch an owner; members cannot manage', async () => {
		const { owner, admin, plain, ws } = await team();
		expect((await call(member.PATCH, { user: plain, params: { id: ws.id, userId: admin.id }, method: 'PATCH', body: { role: 'member' } })).status).toBe(403);
		expect((await call(member.PATCH, { user: admin, params: { id: ws.id, userId: plain.id }, method: 'PATCH', body: { role: 'admin' } })).status).toBe(200);
		expect(await getMembership(ws.id, plain.id)).toEqual({ role: 'admin' });
		expect((await call(member.DELETE, { user: admin, params: { id: ws.id, userId: owner.id }, method: 'DELETE' })).status).toBe(403);
		expect((await call(member.DELETE, { user: admin, params: { id: ws.id, userId: plain.id }, method: 'DELETE' })).status).toBe(204);
		expect(await getMembership(ws.id, plain.id)).toBeNull();
		const events = (await call(audit.GET, { user: owner, params: { id: ws.id } })).body.events.map((e: { type: string }) => e.type);
		expect(events).toEqual(expect.arrayContaining(['role_changed', 'member_removed']));
		expect((await call(audit.GET, { user: admin, params: { id: ws.id } })).status).toBe(200);
	});

	it('the last owner cannot leave (409) until ownership is transferred; then the old owner is an admin and may leave', async () => {
		const { owner, plain, ws } = await team();
		const refused = await call(leave.POST, { user: owner, params: { id: ws.id }, method: 'POST' });
		expect(refused.status).toBe(409);
		expect(refused.body.error).toMatch(/transfer ownership first/);
		expect((await call(transfer.POST, { user: plain, params: { id: ws.id }, method: 'POST', body: { userId: owner.id } })).status).toBe(403);
		expect((await call(transfer.POST, { user: owner, params: { id: ws.id }, method: 'POST', body: { userId: plain.id } })).status).toBe(200);
		expect(await getMembership(ws.id, plain.id)).toEqual({ role: 'owner' });
		expect(await getMembership(ws.id, owner.id)).toEqual({ role: 'admin' });
		expect((await call(leave.POST, { user: owner, params: { id: ws.id }, method: 'POST' })).status).toBe(204);
		expect(await getMembership(ws.id, owner.id)).toBeNull();
		expect((await call(audit.GET, { user: plain, params: { id: ws.id } })).body.events.map((e: { type: string }) => e.type)).toContain('ownership_transferred');
	});
});
