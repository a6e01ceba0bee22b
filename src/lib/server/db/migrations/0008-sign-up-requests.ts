// Sign-up confirmed by e-mail: the form no longer creates the account, so its answer is the
// same whether or not the address already has one. A pending sign-up waits here, keyed by the
// SHA-256 of the token in the mailed link, with the argon2id hash of the chosen password.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: q }: { context: QueryInterface }) {
	await q.createTable('sign_up_requests', {
		id: { type: DataTypes.STRING(64), primaryKey: true },
		email: { type: DataTypes.STRING(254), allowNull: false },
		name: { type: DataTypes.STRING(100), allowNull: false },
		password_hash: { type: DataTypes.STRING(255), allowNull: false },
		// Where to go after confirming (already checked to be a path on this site).
		next: { type: DataTypes.STRING(500), allowNull: true },
		expires_at: { type: DataTypes.DATE, allowNull: false },
		created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW }
	});
	await q.addIndex('sign_up_requests', ['email']);
	await q.addIndex('sign_up_requests', ['expires_at']);
}

export async function down({ context: q }: { context: QueryInterface }) {
	await q.dropTable('sign_up_requests');
}
