// The sharing models, initialised on top of the core set. Kept apart from index.ts so the
// accounts and sharing work can each register their tables without editing one shared list.
import { models } from './index';
import { initInvitation, Invitation } from './invitation';
import { initSheetGrant, SheetGrant } from './sheet-grant';
import { initShareLink, ShareLink } from './share-link';

let ready = false;

export function sharingModels() {
	const core = models();
	if (!ready) {
		const sequelize = core.User.sequelize!;
		initInvitation(sequelize);
		initSheetGrant(sequelize);
		initShareLink(sequelize);
		SheetGrant.belongsTo(core.User, { foreignKey: 'userId', as: 'user' });
		SheetGrant.belongsTo(core.Sheet, { foreignKey: 'sheetId', as: 'sheet' });
		Invitation.belongsTo(core.Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
		Invitation.belongsTo(core.User, { foreignKey: 'invitedBy', as: 'inviter' });
		Invitation.belongsTo(core.Sheet, { foreignKey: 'sheetId', as: 'sheet' });
		ShareLink.belongsTo(core.Sheet, { foreignKey: 'sheetId', as: 'sheet' });
		ready = true;
	}
	return { ...core, Invitation, SheetGrant, ShareLink };
}

export { Invitation, SheetGrant, ShareLink };
