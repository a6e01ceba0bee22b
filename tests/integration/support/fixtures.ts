// A workspace with one person in every standing the access matrix covers, built through the
// data verbs (no passwords: these people never sign in through a form).
import { randomUUID } from 'node:crypto';
import { models } from '../../../src/lib/server/db/models';
import { addMember, createWorkspace, updateWorkspace } from '../../../src/lib/server/db/workspaces';
import { setGrant } from '../../../src/lib/server/db/grants';
import { createSheet } from '../../../src/lib/server/db/sheets';
import { createShareLink } from '../../../src/lib/server/db/share-links';
import type { SheetRole } from '../../../src/lib/server/db/models/workspace';

export type Person = { id: string; email: string; name: string };

export async function person(name: string, address?: string): Promise<Person> {
	const email = address ?? `${name.toLowerCase().replace(/\W+/g, '-')}-${randomUUID().slice(0, 8)}@example.test`;
	const user = await models().User.create({ email, name, passwordHash: null });
	return { id: user.id, email, name };
}

export const network = (r: string) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['a', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['a', 'b'], value: r },
		{ id: 'C1', type: 'C', nodes: ['b', 'gnd'], value: '1n' }
	],
	input: 'V1',
	output: { node: 'b' }
});

/**
 * The standings: owner, admin, a plain member (the workspace default here is viewer), members
 * raised by a grant to editor / commenter / viewer, a guest (editor on this sheet only, not a
 * member), and someone who owns another workspace.
 */
export async function matrixWorld() {
	const [owner, admin, member, editor, commenter, viewer, guest, outsider] = await Promise.all(
		['Owner', 'Admin', 'Member', 'Editor', 'Commenter', 'Viewer', 'Guest', 'Outsider'].map((name) => person(name))
	);
	const workspace = await createWorkspace(owner.id, 'Bench 7 — probe front ends');
	await updateWorkspace(workspace.id, { defaultSheetRole: 'viewer' });
	await addMember(workspace.id, admin.id, 'admin');
	for (const p of [member, editor, commenter, viewer]) await addMember(workspace.id, p.id, 'member');
	const elsewhere = await createWorkspace(outsider.id, 'Another lab');
	const grants: [Person, SheetRole][] = [[editor, 'editor'], [commenter, 'commenter'], [viewer, 'viewer'], [guest, 'editor']];

	/** A fresh sheet with the grants above and a live read-only link. */
	async function sheet(name = 'Divider 10:1') {
		const { sheet } = await createSheet({ userId: owner.id, workspaceId: workspace.id, name, document: network('9M') });
		for (const [p, role] of grants) await setGrant(sheet.id, p.id, role, owner.id);
		const { token } = await createShareLink(sheet.id, owner.id);
		return { sheet, token };
	}
	return { owner, admin, member, editor, commenter, viewer, guest, outsider, workspace, elsewhere, sheet };
}
