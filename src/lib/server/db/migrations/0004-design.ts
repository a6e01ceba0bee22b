// Design aids: the spec limits and tolerances a sheet keeps for its design aids (one row per
// sheet, not revisioned: limits are the target, not the design), and the tolerance runs with
// the revision they ran on, their progress, and their stored result. The queue itself is
// pg-boss's own schema (created by pg-boss at start); this table is what people see.
import { DataTypes, type QueryInterface } from 'sequelize';

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };

export async function up({ context: q }: { context: QueryInterface }) {
	await q.createTable('design_settings', {
		sheet_id: {
			type: DataTypes.UUID,
			primaryKey: true,
			references: { model: 'sheets', key: 'id' },
			onDelete: 'CASCADE'
		},
		settings: { type: DataTypes.JSONB, allowNull: false },
		updated_by: {
			type: DataTypes.UUID,
			allowNull: true,
			references: { model: 'users', key: 'id' },
			onDelete: 'SET NULL'
		},
		created_at: now,
		updated_at: now
	});
	await q.createTable('design_jobs', {
		id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
		sheet_id: {
			type: DataTypes.UUID,
			allowNull: false,
			references: { model: 'sheets', key: 'id' },
			onDelete: 'CASCADE'
		},
		revision: { type: DataTypes.INTEGER, allowNull: false },
		kind: { type: DataTypes.STRING(24), allowNull: false },
		state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
		request: { type: DataTypes.JSONB, allowNull: false },
		done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
		total: { type: DataTypes.INTEGER, allowNull: false },
		cancel_requested: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
		result: { type: DataTypes.JSONB, allowNull: true },
		error: { type: DataTypes.TEXT, allowNull: true },
		queue_id: { type: DataTypes.STRING(64), allowNull: true },
		created_by: {
			type: DataTypes.UUID,
			allowNull: true,
			references: { model: 'users', key: 'id' },
			onDelete: 'SET NULL'
		},
		created_at: now,
		started_at: { type: DataTypes.DATE, allowNull: true },
		finished_at: { type: DataTypes.DATE, allowNull: true }
	});
	await q.addIndex('design_jobs', ['sheet_id', 'created_at']);
	await q.sequelize.query(
		`ALTER TABLE design_jobs ADD CONSTRAINT design_jobs_state_check CHECK (state IN ('queued','running','done','failed','cancelled'))`
	);
}

export async function down({ context: q }: { context: QueryInterface }) {
	await q.dropTable('design_jobs');
	await q.dropTable('design_settings');
}
