// Identity: personal API tokens, password-reset links, the audit log and the rate-limit counters.
// Every secret is stored only as the SHA-256 (hex) of what the user holds, so a leaked table
// gives no working token or link.
import { DataTypes, type QueryInterface } from 'sequelize';

const createdAt = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };
const userRef = (onDelete: 'CASCADE' | 'SET NULL', allowNull = false) => ({
	type: DataTypes.UUID,
	allowNull,
	references: { model: 'users', key: 'id' },
	onDelete
});

export async function up({ context: q }: { context: QueryInterface }) {
	// Addresses are stored lower-cased; this index makes a mixed-case duplicate impossible too.
	await q.sequelize.query(`CREATE UNIQUE INDEX users_email_lower_unique ON users (lower(email))`);
	await q.createTable('api_tokens', {
		id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
		user_id: userRef('CASCADE'),
		name: { type: DataTypes.STRING(60), allowNull: false },
		token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
		// The first characters of the token, shown in the list so people can tell tokens apart.
		prefix: { type: DataTypes.STRING(16), allowNull: false },
		last_used_at: { type: DataTypes.DATE, allowNull: true },
		revoked_at: { type: DataTypes.DATE, allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('api_tokens', ['user_id']);
	await q.createTable('password_resets', {
		id: { type: DataTypes.STRING(64), primaryKey: true },
		user_id: userRef('CASCADE'),
		expires_at: { type: DataTypes.DATE, allowNull: false },
		used_at: { type: DataTypes.DATE, allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('password_resets', ['user_id']);
	await q.createTable('audit_events', {
		id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
		type: { type: DataTypes.STRING(32), allowNull: false },
		actor_id: userRef('SET NULL', true),
		workspace_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
		// No foreign key: a `sheet_deleted` event must keep naming the sheet it is about.
		sheet_id: { type: DataTypes.UUID, allowNull: true },
		detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
		ip: { type: DataTypes.STRING(45), allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('audit_events', ['workspace_id', 'created_at']);
	await q.addIndex('audit_events', ['actor_id', 'created_at']);
	// Fixed-window counters shared by every app process behind the load balancer.
	await q.createTable('rate_limits', {
		key: { type: DataTypes.STRING(300), primaryKey: true },
		points: { type: DataTypes.INTEGER, allowNull: false },
		expires_at: { type: DataTypes.DATE, allowNull: false }
	});
	await q.addIndex('rate_limits', ['expires_at']);
}

export async function down({ context: q }: { context: QueryInterface }) {
	for (const table of ['rate_limits', 'audit_events', 'password_resets', 'api_tokens']) await q.dropTable(table);
	await q.sequelize.query(`DROP INDEX IF EXISTS users_email_lower_unique`);
}
