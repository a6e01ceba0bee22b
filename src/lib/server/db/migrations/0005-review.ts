// Team review: comments pinned to parts, nets and results; review requests with one answer per
// reviewer; review meetings; notifications; the per-sheet activity of comments and reviews; and
// the live event log that server-sent events replay from.
//
// live_events is the single source of "what happened on this channel, in order": its bigserial id
// is the SSE event id, so a browser reconnecting with Last-Event-ID gets exactly what it missed,
// whichever app process it reconnects to. A trigger adds a row for every new sheet revision (the
// save code does not need to know about live updates) and every insert is announced with
// pg_notify so listening processes wake at once instead of waiting for their next poll.
import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };
const createdAt = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };
const ref = (table: string, onDelete = 'CASCADE', allowNull = false) => ({
	type: DataTypes.UUID,
	allowNull,
	references: { model: table, key: 'id' },
	onDelete
});

export async function up({ context: q }: { context: QueryInterface }) {
	await q.createTable('comments', {
		id,
		sheet_id: ref('sheets'),
		// A reply points at its thread's first comment; threads are one level deep.
		parent_id: ref('comments', 'CASCADE', true),
		author_id: ref('users', 'SET NULL', true),
		revision_number: { type: DataTypes.INTEGER, allowNull: false },
		anchor_kind: { type: DataTypes.STRING(16), allowNull: false },
		anchor_ref: { type: DataTypes.STRING(64), allowNull: true },
		// What the anchor looked like when the comment was written (element type/value/nodes,
		// or the pole's value and owners): later revisions are compared against it.
		anchor_snapshot: { type: DataTypes.JSONB, allowNull: true },
		body: { type: DataTypes.TEXT, allowNull: false },
		body_html: { type: DataTypes.TEXT, allowNull: false },
		mentions: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
		resolved_at: { type: DataTypes.DATE, allowNull: true },
		resolved_by: ref('users', 'SET NULL', true),
		edited_at: { type: DataTypes.DATE, allowNull: true },
		deleted_at: { type: DataTypes.DATE, allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('comments', ['sheet_id', 'created_at']);
	await q.addIndex('comments', ['parent_id']);
	await q.sequelize.query(
		`ALTER TABLE comments ADD CONSTRAINT comments_anchor_check CHECK (anchor_kind IN ('sheet','element','net','pole','zero','time_constant','spec'))`
	);

	await q.createTable('review_requests', {
		id,
		sheet_id: ref('sheets'),
		revision_number: { type: DataTypes.INTEGER, allowNull: false },
		requested_by: ref('users', 'SET NULL', true),
		message: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
		due_on: { type: DataTypes.DATEONLY, allowNull: true },
		withdrawn_at: { type: DataTypes.DATE, allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('review_requests', ['sheet_id', 'created_at']);
	await q.createTable('review_answers', {
		id,
		request_id: ref('review_requests'),
		reviewer_id: ref('users'),
		decision: { type: DataTypes.STRING(16), allowNull: true },
		summary: { type: DataTypes.TEXT, allowNull: true },
		answered_at: { type: DataTypes.DATE, allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('review_answers', ['request_id', 'reviewer_id'], { unique: true });
	await q.addIndex('review_answers', ['reviewer_id']);
	await q.sequelize.query(`ALTER TABLE review_answers ADD CONSTRAINT review_answers_decision_check CHECK (decision IS NULL OR decision IN ('approve','changes'))`);

	await q.createTable('meetings', {
		id,
		workspace_id: ref('workspaces'),
		title: { type: DataTypes.STRING(120), allowNull: false },
		held_on: { type: DataTypes.DATEONLY, allowNull: false },
		created_by: ref('users', 'SET NULL', true),
		created_at: createdAt
	});
	await q.addIndex('meetings', ['workspace_id', 'held_on']);
	await q.createTable('meeting_attendees', {
		meeting_id: { ...ref('meetings'), primaryKey: true },
		user_id: { ...ref('users'), primaryKey: true }
	});
	await q.createTable('meeting_items', {
		id,
		meeting_id: ref('meetings'),
		position: { type: DataTypes.INTEGER, allowNull: false },
		sheet_id: ref('sheets'),
		revision_number: { type: DataTypes.INTEGER, allowNull: false },
		outcome: { type: DataTypes.STRING(16), allowNull: true },
		notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
		created_at: createdAt
	});
	await q.addIndex('meeting_items', ['meeting_id', 'position']);
	await q.sequelize.query(`ALTER TABLE meeting_items ADD CONSTRAINT meeting_items_outcome_check CHECK (outcome IS NULL OR outcome IN ('accepted','rework','parked'))`);

	await q.createTable('notifications', {
		id,
		user_id: ref('users'),
		kind: { type: DataTypes.STRING(24), allowNull: false },
		actor_id: ref('users', 'SET NULL', true),
		sheet_id: ref('sheets', 'CASCADE', true),
		detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
		read_at: { type: DataTypes.DATE, allowNull: true },
		created_at: createdAt
	});
	await q.addIndex('notifications', ['user_id', 'created_at']);

	await q.createTable('activity', {
		id,
		workspace_id: ref('workspaces'),
		sheet_id: ref('sheets', 'CASCADE', true),
		actor_id: ref('users', 'SET NULL', true),
		kind: { type: DataTypes.STRING(24), allowNull: false },
		detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
		created_at: createdAt
	});
	await q.addIndex('activity', ['workspace_id', 'created_at']);
	await q.addIndex('activity', ['sheet_id', 'created_at']);

	await q.sequelize.query(`
		CREATE TABLE live_events (
			id bigserial PRIMARY KEY,
			channel varchar(64) NOT NULL,
			kind varchar(32) NOT NULL,
			payload jsonb NOT NULL DEFAULT '{}',
			created_at timestamptz NOT NULL DEFAULT now()
		);
		CREATE INDEX live_events_channel_id ON live_events (channel, id);
		CREATE INDEX live_events_created_at ON live_events (created_at);

		CREATE FUNCTION live_events_announce() RETURNS trigger AS $$
		BEGIN
			PERFORM pg_notify('polewise_live', NEW.channel || ' ' || NEW.id);
			RETURN NEW;
		END $$ LANGUAGE plpgsql;
		CREATE TRIGGER live_events_announce AFTER INSERT ON live_events
			FOR EACH ROW EXECUTE FUNCTION live_events_announce();

		CREATE FUNCTION live_events_from_revision() RETURNS trigger AS $$
		BEGIN
			INSERT INTO live_events (channel, kind, payload)
			VALUES ('sheet:' || NEW.sheet_id, 'revision',
				jsonb_build_object('number', NEW.number, 'authorId', NEW.author_id, 'message', NEW.message));
			RETURN NEW;
		END $$ LANGUAGE plpgsql;
		CREATE TRIGGER live_events_from_revision AFTER INSERT ON sheet_revisions
			FOR EACH ROW EXECUTE FUNCTION live_events_from_revision();
	`);
}

export async function down({ context: q }: { context: QueryInterface }) {
	await q.sequelize.query(`
		DROP TRIGGER IF EXISTS live_events_from_revision ON sheet_revisions;
		DROP FUNCTION IF EXISTS live_events_from_revision();
		DROP TABLE IF EXISTS live_events;
		DROP FUNCTION IF EXISTS live_events_announce();
	`);
	for (const table of ['activity', 'notifications', 'meeting_items', 'meeting_attendees', 'meetings', 'review_answers', 'review_requests', 'comments']) {
		await q.dropTable(table);
	}
}
