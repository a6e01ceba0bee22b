// First schema: people and their sessions, workspaces with memberships, sheets with immutable
// revisions. Shaped for the accounts work to come: roles are text checked by constraints so a
// new role is a migration, not a type change.
import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };
const timestamps = {
	created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
	updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW }
};
const ref = (table: string, onDelete = 'CASCADE', allowNull = false) => ({
	type: DataTypes.UUID,
	allowNull,
	references: { model: table, key: 'id' },
	onDelete
});

export async function up({ context: q }: { context: QueryInterface }) {
	await q.createTable('users', {
		id,
		email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
		name: { type: DataTypes.STRING(100), allowNull: false },
		password_hash: { type: DataTypes.STRING(255), allowNull: true },
		...timestamps
	});
	await q.createTable('sessions', {
		// The SHA-256 of the cookie's token, hex: a leaked table does not give working cookies.
		id: { type: DataTypes.STRING(64), primaryKey: true },
		user_id: ref('users'),
		expires_at: { type: DataTypes.DATE, allowNull: false },
		created_at: timestamps.created_at
	});
	await q.addIndex('sessions', ['user_id']);
	await q.createTable('workspaces', {
		id,
		name: { type: DataTypes.STRING(100), allowNull: false },
		default_sheet_role: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'editor' },
		...timestamps
	});
	await q.createTable('memberships', {
		id,
		workspace_id: ref('workspaces'),
		user_id: ref('users'),
		role: { type: DataTypes.STRING(16), allowNull: false },
		...timestamps
	});
	await q.addIndex('memberships', ['workspace_id', 'user_id'], { unique: true });
	await q.createTable('sheets', {
		id,
		workspace_id: ref('workspaces'),
		name: { type: DataTypes.STRING(120), allowNull: false },
		status: { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'draft' },
		latest_revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
		created_by: ref('users', 'SET NULL', true),
		updated_by: ref('users', 'SET NULL', true),
		trashed_at: { type: DataTypes.DATE, allowNull: true },
		...timestamps
	});
	await q.addIndex('sheets', ['workspace_id', 'trashed_at']);
	await q.createTable('sheet_revisions', {
		id,
		sheet_id: ref('sheets'),
		number: { type: DataTypes.INTEGER, allowNull: false },
		author_id: ref('users', 'SET NULL', true),
		document: { type: DataTypes.JSONB, allowNull: false },
		layout: { type: DataTypes.JSONB, allowNull: true },
		message: { type: DataTypes.STRING(200), allowNull: true },
		created_at: timestamps.created_at
	});
	// The unique (sheet, number) pair is what makes two saves on one base revision collide.
	await q.addIndex('sheet_revisions', ['sheet_id', 'number'], { unique: true });
	await q.sequelize.query(`ALTER TABLE memberships ADD CONSTRAINT memberships_role_check CHECK (role IN ('owner','admin','member'))`);
	await q.sequelize.query(`ALTER TABLE workspaces ADD CONSTRAINT workspaces_default_sheet_role_check CHECK (default_sheet_role IN ('editor','commenter','viewer'))`);
}

export async function down({ context: q }: { context: QueryInterface }) {
	for (const table of ['sheet_revisions', 'sheets', 'memberships', 'workspaces', 'sessions', 'users']) {
		await q.dropTable(table);
	}
}
