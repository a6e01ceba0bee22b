// A revision can be named ("first prototype", "as built"): a checkpoint people refer to. The
// name is a label on the revision, not part of its content (revisions stay immutable otherwise).
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: q }: { context: QueryInterface }) {
	await q.addColumn('sheet_revisions', 'name', { type: DataTypes.STRING(80), allowNull: true });
}

export async function down({ context: q }: { context: QueryInterface }) {
	await q.removeColumn('sheet_revisions', 'name');
}
