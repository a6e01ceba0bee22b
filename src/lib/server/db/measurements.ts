// Measured-response data verbs. A measurement belongs to one sheet; its curve is stored parsed
// (JSON) beside the file it came from (bytea), so the overlay never re-parses and the person
// can still download exactly what they uploaded.
import { QueryTypes } from 'sequelize';
import { db } from './connection';

export interface MeasurementCurve {
	f: number[];
	magnitudeDb: number[];
	phaseDeg: number[] | null;
}

export interface MeasurementSummary {
	id: string;
	sheetId: string;
	name: string;
	fileName: string;
	points: number;
	fMin: number;
	fMax: number;
	byteSize: number;
	hasPhase: boolean;
	columns: unknown;
	createdBy: string | null;
	createdByName: string | null;
	createdAt: Date;
	updatedAt: Date;
}

export interface MeasurementRecord extends MeasurementSummary {
	curve: MeasurementCurve;
}

const FIELDS = `m.id, m.sheet_id AS "sheetId", m.name, m.file_name AS "fileName", m.points, m.f_min AS "fMin", m.f_max AS "fMax",
	m.byte_size AS "byteSize", (m.curve->'phaseDeg') IS NOT NULL AND jsonb_typeof(m.curve->'phaseDeg') = 'array' AS "hasPhase",
	m.columns, m.created_by AS "createdBy", u.name AS "createdByName", m.created_at AS "createdAt", m.updated_at AS "updatedAt"`;
const FROM = `FROM measurements m LEFT JOIN users u ON u.id = m.created_by`;

export async function createMeasurement(input: {
	sheetId: string;
	userId: string;
	name: string;
	fileName: string;
	columns: unknown;
	curve: MeasurementCurve;
	source: Buffer;
}): Promise<MeasurementRecord> {
	const { curve } = input;
	const [row] = await db().query<{ id: string }>(
		`INSERT INTO measurements (id, sheet_id, name, file_name, columns, curve, points, f_min, f_max, source, byte_size, created_by, created_at, updated_at)
		 VALUES (gen_random_uuid(), $1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, now(), now()) RETURNING id`,
		{
			bind: [
				input.sheetId,
				input.name,
				input.fileName,
				JSON.stringify(input.columns),
				JSON.stringify(curve),
				curve.f.length,
				curve.f[0],
				curve.f[curve.f.length - 1],
				input.source,
				input.source.length,
				input.userId
			],
			type: QueryTypes.SELECT
		}
	);
	return (await getMeasurement(input.sheetId, row.id))!;
}

export async function listMeasurements(sheetId: string): Promise<MeasurementSummary[]> {
	return db().query<MeasurementSummary>(
		`SELECT ${FIELDS} ${FROM} WHERE m.sheet_id = $1 ORDER BY m.created_at, m.id`,
		{ bind: [sheetId], type: QueryTypes.SELECT }
	);
}

/** Every measurement of a sheet with its curve (for the overlay and the report). */
export async function listMeasurementCurves(sheetId: string): Promise<MeasurementRecord[]> {
	return db().query<MeasurementRecord>(
		`SELECT ${FIELDS}, m.curve ${FROM} WHERE m.sheet_id = $1 ORDER BY m.created_at, m.id`,
		{ bind: [sheetId], type: QueryTypes.SELECT }
	);
}

export async function getMeasurement(
	sheetId: string,
	id: string
): Promise<MeasurementRecord | null> {
	const rows = await db().query<MeasurementRecord>(
		`SELECT ${FIELDS}, m.curve ${FROM} WHERE m.sheet_id = $1 AND m.id = $2`,
		{ bind: [sheetId, id], type: QueryTypes.SELECT }
	);
	return rows[0] ?? null;
}

export async function measurementSource(
	sheetId: string,
	id: string
): Promise<{ fileName: string; source: Buffer } | null> {
	const rows = await db().query<{ fileName: string; source: Buffer }>(
		`SELECT file_name AS "fileName", source FROM measurements WHERE sheet_id = $1 AND id = $2`,
		{
			bind: [sheetId, id],
			type: QueryTypes.SELECT
		}
	);
	return rows[0] ?? null;
}

export async function renameMeasurement(
	sheetId: string,
	id: string,
	name: string
): Promise<MeasurementRecord | null> {
	await db().query(
		`UPDATE measurements SET name = $3, updated_at = now() WHERE sheet_id = $1 AND id = $2`,
		{ bind: [sheetId, id, name] }
	);
	return getMeasurement(sheetId, id);
}

export async function deleteMeasurement(sheetId: string, id: string): Promise<boolean> {
	const rows = await db().query<{ id: string }>(
		`DELETE FROM measurements WHERE sheet_id = $1 AND id = $2 RETURNING id`,
		{ bind: [sheetId, id], type: QueryTypes.SELECT }
	);
	return rows.length > 0;
}

export async function countMeasurements(sheetId: string): Promise<number> {
	const [row] = await db().query<{ n: number }>(
		`SELECT count(*)::int AS n FROM measurements WHERE sheet_id = $1`,
		{ bind: [sheetId], type: QueryTypes.SELECT }
	);
	return row.n;
}
