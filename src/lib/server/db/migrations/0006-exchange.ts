// Data in and out: measured responses (the parsed curve as JSON beside the uploaded file, kept
// as bytea so it can be downloaded again exactly) and attachments on sheets and comments (the
// file itself as bytea, its type decided from its content). Both go with their sheet.
import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };
const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };
const ref = (table: string, onDelete = 'CASCADE', allowNull = false) => ({
	type: DataTypes.UUID,
	allowNull,
	references: { model: table, key: 'id' },
	onDelete
});

export async function up({ context: q }: { context: QueryInterface }) {
	await q.createTable('measurements', {
		id,
		sheet_id: ref('sheets'),
		name: { type: DataTypes.STRING(120), allowNull: false },
		file_name: { type: DataTypes.STRING(255), allowNull: false },
		// The confirmed column choice (which column, which unit) the curve was read with.
		columns: { type: DataTypes.JSONB, allowNull: false },
		// { f: Hz[], magnitudeDb: dB[], phaseDeg: deg[] | null }, ascending frequency.
		curve: { type: DataTypes.JSONB, allowNull: false },
		points: { type: DataTypes.INTEGER, allowNull: false },
		f_min: { type: DataTypes.DOUBLE, allowNull: false },
		f_max: { type: DataTypes.DOUBLE, allowNull: false },
		source: { type: DataTypes.BLOB, allowNull: false },
		byte_size: { type: DataTypes.INTEGER, allowNull: false },
		created_by: ref('users', 'SET NULL', true),
		created_at: now,
		updated_at: now
	});
	await q.addIndex('measurements', ['sheet_id', 'created_at']);

	await q.createTable('attachments', {
		id,
		sheet_id: ref('sheets'),
		// Set when the file belongs to a comment (the review module's table); null for the sheet.
		comment_id: { type: DataTypes.UUID, allowNull: true },
		file_name: { type: DataTypes.STRING(255), allowNull: false },
		// Decided from the file's first bytes, never from the name or the browser's claim.
		content_type: { type: DataTypes.STRING(64), allowNull: false },
		byte_size: { type: DataTypes.INTEGER, allowNull: false },
		sha256: { type: DataTypes.STRING(64), allowNull: false },
		data: { type: DataTypes.BLOB, allowNull: false },
		created_by: ref('users', 'SET NULL', true),
		created_at: now
	});
	await q.addIndex('attachments', ['sheet_id', 'created_at']);
	await q.addIndex('attachments', ['comment_id']);
	await q.sequelize.query(
		`ALTER TABLE attachments ADD CONSTRAINT attachments_type_check CHECK (content_type IN ('image/png','image/jpeg','image/gif','image/webp','application/pdf'))`
	);
	// The comments table comes from the review migration; tie to it when it is there.
	const [[found]] = (await q.sequelize.query(
		`SELECT to_regclass('public.comments') IS NOT NULL AS present`
	)) as [[{ present: boolean }], unknown];
	if (found.present) {
		await q.sequelize.query(
			`ALTER TABLE attachments ADD CONSTRAINT attachments_comment_fk FOREIGN KEY (comment_id) REFERENCES comments(id) ON DELETE CASCADE`
		);
	}
}

export async function down({ context: q }: { context: QueryInterface }) {
	for (const table of ['attachments', 'measurements']) await q.dropTable(table);
}
