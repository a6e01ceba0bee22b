// Jobs that survive crashed workers: which start of the job this is (`attempt`), which worker
// process holds it (`worker_id`), when that worker last said it is alive (`heartbeat_at`), and
// what happened to it on the way (`recovery`, shown to people: "taken over after the worker
// running it stopped"). See src/lib/server/jobs/runner.ts.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: q }: { context: QueryInterface }) {
	await q.addColumn('design_jobs', 'attempt', {
		type: DataTypes.INTEGER,
		allowNull: false,
		defaultValue: 0
	});
	await q.addColumn('design_jobs', 'worker_id', { type: DataTypes.STRING(160), allowNull: true });
	await q.addColumn('design_jobs', 'heartbeat_at', { type: DataTypes.DATE, allowNull: true });
	await q.addColumn('design_jobs', 'recovery', { type: DataTypes.TEXT, allowNull: true });
	// The sweep looks for running jobs only; most rows are finished.
	await q.sequelize.query(
		`CREATE INDEX design_jobs_running ON design_jobs (heartbeat_at) WHERE state IN ('queued', 'running')`
	);
}

export async function down({ context: q }: { context: QueryInterface }) {
	await q.sequelize.query('DROP INDEX IF EXISTS design_jobs_running');
	for (const column of ['recovery', 'heartbeat_at', 'worker_id', 'attempt']) {
		await q.removeColumn('design_jobs', column);
	}
}
