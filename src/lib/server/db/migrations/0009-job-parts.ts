// Saved progress of resumable jobs: a tolerance run keeps each finished chunk of runs, so a job
// taken over from a worker that died continues where that worker stopped instead of starting
// again. Rows go as soon as their job ends (a trigger: whatever ends it — the worker, a cancel,
// a sweep marking it failed), so only unfinished jobs keep any.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: q }: { context: QueryInterface }) {
	await q.createTable('design_job_parts', {
		job_id: {
			type: DataTypes.UUID,
			allowNull: false,
			primaryKey: true,
			references: { model: 'design_jobs', key: 'id' },
			onDelete: 'CASCADE'
		},
		first: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
		count: { type: DataTypes.INTEGER, allowNull: false },
		records: { type: DataTypes.JSONB, allowNull: false },
		created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW }
	});
	await q.sequelize.query(`
		CREATE FUNCTION design_job_parts_forget() RETURNS trigger LANGUAGE plpgsql AS $$
		BEGIN
			DELETE FROM design_job_parts WHERE job_id = NEW.id;
			RETURN NEW;
		END $$`);
	await q.sequelize.query(`
		CREATE TRIGGER design_job_parts_forget AFTER UPDATE OF state ON design_jobs
		FOR EACH ROW WHEN (NEW.state IN ('done', 'failed', 'cancelled'))
		EXECUTE FUNCTION design_job_parts_forget()`);
}

export async function down({ context: q }: { context: QueryInterface }) {
	await q.sequelize.query('DROP TRIGGER IF EXISTS design_job_parts_forget ON design_jobs');
	await q.sequelize.query('DROP FUNCTION IF EXISTS design_job_parts_forget()');
	await q.dropTable('design_job_parts');
}
