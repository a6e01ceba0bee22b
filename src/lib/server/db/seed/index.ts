// The demo workspace: two people of an invented lab and its three designs. Idempotent: a
// second run finds the demo user and changes nothing.
import { hashPassword } from '../../auth/password';
import { db } from '../connection';
import { models } from '../models';
import { createSheet } from '../sheets';
import { demoSheets } from './demo-sheets';
import { saveDesignSettings } from '../design-jobs';

export const DEMO_USERS = [
	{ email: 'demo@polewise.test', name: 'Mira Castell', password: 'polewise-demo', role: 'owner' as const },
	{ email: 'reviewer@polewise.test', name: 'Tomas Reyes', password: 'polewise-review', role: 'member' as const }
];
export const DEMO_WORKSPACE = 'Kestrel Ridge Instruments — front ends';

export async function seedDemo(): Promise<{ created: boolean }> {
	const { User, Workspace, Membership } = models();
	if (await User.findOne({ where: { email: DEMO_USERS[0].email } })) return { created: false };
	const hashes = await Promise.all(DEMO_USERS.map((u) => hashPassword(u.password)));
	const owner = await db().transaction(async (transaction) => {
		const workspace = await Workspace.create({ name: DEMO_WORKSPACE }, { transaction });
		let ownerId = '';
		for (const [i, person] of DEMO_USERS.entries()) {
			const user = await User.create({ email: person.email, name: person.name, passwordHash: hashes[i] }, { transaction });
			await Membership.create({ workspaceId: workspace.id, userId: user.id, role: person.role }, { transaction });
			if (person.role === 'owner') ownerId = user.id;
		}
		return { workspaceId: workspace.id, userId: ownerId };
	});
	for (const sheet of demoSheets) {
		const made = await createSheet({ ...owner, name: sheet.name, document: sheet.document });
		if (sheet.settings) await saveDesignSettings(made.sheet.id, owner.userId, sheet.settings);
	}
	return { created: true };
}
