// Models and their associations, initialised once on the shared connection.
import { db } from '../connection';
import { initUser, User } from './user';
import { initSession, Session } from './session';
import { initWorkspace, Workspace } from './workspace';
import { initMembership, Membership } from './membership';
import { initSheet, Sheet } from './sheet';
import { initSheetRevision, SheetRevision } from './sheet-revision';
import { initApiToken, ApiToken } from './api-token';
import { initPasswordReset, PasswordReset } from './password-reset';
import { initAuditEvent, AuditEvent } from './audit-event';

let ready = false;

export function models() {
	if (!ready) {
		const sequelize = db();
		initUser(sequelize);
		initSession(sequelize);
		initWorkspace(sequelize);
		initMembership(sequelize);
		initSheet(sequelize);
		initSheetRevision(sequelize);
		initApiToken(sequelize);
		initPasswordReset(sequelize);
		initAuditEvent(sequelize);
		ApiToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
		PasswordReset.belongsTo(User, { foreignKey: 'userId', as: 'user' });
		AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
		Session.belongsTo(User, { foreignKey: 'userId', as: 'user' });
		Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
		Membership.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
		Workspace.hasMany(Membership, { foreignKey: 'workspaceId', as: 'memberships' });
		Sheet.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
		Sheet.hasMany(SheetRevision, { foreignKey: 'sheetId', as: 'revisions' });
		SheetRevision.belongsTo(Sheet, { foreignKey: 'sheetId', as: 'sheet' });
		SheetRevision.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
		ready = true;
	}
	return { User, Session, Workspace, Membership, Sheet, SheetRevision, ApiToken, PasswordReset, AuditEvent };
}

export { User, Session, Workspace, Membership, Sheet, SheetRevision, ApiToken, PasswordReset, AuditEvent };
