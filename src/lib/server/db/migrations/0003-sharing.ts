// Sharing: workspace invitations (also used to invite a guest to one sheet), per-sheet grants
// for members and guests, and revocable read-only links. Every secret token is stored only as
// its SHA-256 (hex): a leaked table gives no working link.
import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };
const createdAt = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };
const ref = (table: string, onDelete = 'CASCADE', allowNull = false) => ({
	type: DataTypes.UUID,
	allowNull,
	references: { model: table, key: 'id' },
	onDelete
});
const tokenHash = { type: DataTypes.STRING(64), allowNull: false, unique: true };

export async function up({ context: q }: { context: QueryInterface }) {
	await q.createTable('invitations', {
		id,
		workspace_id: ref('workspaces'),
		// Set for a guest invitation: the invitee gets a grant on this one sheet, no membership.
		sheet_id: ref('sheets', 'CASCADE', true),
		email: { type: DataTypes.STRING(254), allowNull: false },
		role: { type: DataTypes.STRING(16), allowNull: false },
		token_hash: tokenHash,
		invited_by: ref('users', 'SET NULL', true),
		expires_at: { type: DataTypes.DATE, allowNull: false },
		accepted_at: { type: DataTypes.DATE, allowNull: true },
		accepted_by: ref('users', 'SET NULL', true),
		revoked_at: { type: DataTypes.DATE, allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('invitations', ['workspace_id', 'accepted_at', 'revoked_at']);
	await q.sequelize.query(
		`ALTER TABLE invitations ADD CONSTRAINT invitations_role_check CHECK (
			(sheet_id IS NULL AND role IN ('admin','member')) OR (sheet_id IS NOT NULL AND role IN ('editor','commenter','viewer')))`
	);

	await q.createTable('sheet_grants', {
		id,
		sheet_id: ref('sheets'),
		user_id: ref('users'),
		role: { type: DataTypes.STRING(16), allowNull: false },
		granted_by: ref('users', 'SET NULL', true),
		created_at: createdAt,
		updated_at: createdAt
	});
	await q.addIndex('sheet_grants', ['sheet_id', 'user_id'], { unique: true });
	await q.addIndex('sheet_grants', ['user_id']);
	await q.sequelize.query(`ALTER TABLE sheet_grants ADD CONSTRAINT sheet_grants_role_check CHECK (role IN ('editor','commenter','viewer'))`);

	await q.createTable('share_links', {
		id,
		sheet_id: ref('sheets'),
		token_hash: tokenHash,
		label: { type: DataTypes.STRING(80), allowNull: true },
		created_by: ref('users', 'SET NULL', true),
		revoked_at: { type: DataTypes.DATE, allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('share_links', ['sheet_id']);
}

export async function down({ context: q }: { context: QueryInterface }) {
	for (const table of ['share_links', 'sheet_grants', 'invitations']) await q.dropTable(table);
}
