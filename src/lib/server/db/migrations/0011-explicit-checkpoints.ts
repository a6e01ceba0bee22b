// A person can mark a checkpoint from the editor (Ctrl+S, "Checkpoint"): the revision ends the
// group of saves it belongs to even without a name or a message. A flag on the revision, not
// part of its content (revisions stay immutable otherwise).
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: q }: { context: QueryInterface }) {
	await q.addColumn('sheet_revisions', 'checkpoint', {
		type: DataTypes.BOOLEAN,
		allowNull: false,
		defaultValue: false
	});
}

export async function down({ context: q }: { context: QueryInterface }) {
	await q.removeColumn('sheet_revisions', 'checkpoint');
}
