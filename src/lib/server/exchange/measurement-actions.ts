// Measured responses of a sheet, behind the access module: readers list and read them, people
// who may save the sheet upload, rename and delete them.
import { z } from 'zod';
import { authorizeSheet, type Actor } from '../access';
import { ApiProblem } from '../api/respond';
import * as store from '../db/measurements';
import { columnChoiceSchema, parseMeasured } from '../../exchange';
import { PER_SHEET } from './limits';
import { uploadedText } from './text-file';
import type { Upload } from './upload';

export const measurementName = z
	.string()
	.trim()
	.min(1, 'name is empty')
	.max(120, 'name is too long (at most 120 characters)');

export async function listMeasurementsAs(actor: Actor, sheetId: string, withCurves = false) {
	await authorizeSheet(actor, sheetId, 'read');
	return withCurves ? store.listMeasurementCurves(sheetId) : store.listMeasurements(sheetId);
}

export async function getMeasurementAs(actor: Actor, sheetId: string, id: string) {
	await authorizeSheet(actor, sheetId, 'read');
	const m = await store.getMeasurement(sheetId, id);
	if (!m) throw new ApiProblem(404, 'Not found.');
	return m;
}

export async function measurementFileAs(actor: Actor, sheetId: string, id: string) {
	await authorizeSheet(actor, sheetId, 'read');
	const m = await store.measurementSource(sheetId, id);
	if (!m) throw new ApiProblem(404, 'Not found.');
	return m;
}

function readColumns(raw: string | undefined) {
	if (raw === undefined || raw === '') return undefined;
	let data: unknown;
	try {
		data = JSON.parse(raw);
	} catch {
		throw new ApiProblem(400, 'columns: not valid JSON');
	}
	const parsed = columnChoiceSchema.safeParse(data);
	if (!parsed.success)
		throw new ApiProblem(
			400,
			`columns.${parsed.error.issues[0].path.join('.')}: ${parsed.error.issues[0].message}`
		);
	return parsed.data;
}

/** Parse and store an upload; 422 names the row and column of the first bad cell. */
export async function uploadMeasurementAs(
	actor: Actor & { kind: 'user' },
	sheetId: string,
	upload: Upload
) {
	await authorizeSheet(actor, sheetId, 'save');
	const columns = readColumns(upload.fields.columns);
	const name = measurementName.safeParse(
		upload.fields.name || upload.fileName.replace(/\.[^.]+$/, '') || 'Measurement'
	);
	if (!name.success) throw new ApiProblem(400, `name: ${name.error.issues[0].message}`);
	const text = uploadedText(upload.bytes);
	const result = parseMeasured(text, columns);
	if (!result.ok)
		throw new ApiProblem(422, result.error.message, {
			code: 'bad_csv',
			row: result.error.row,
			column: result.error.column
		});
	if ((await store.countMeasurements(sheetId)) >= PER_SHEET.measurements) {
		throw new ApiProblem(
			409,
			`A sheet holds at most ${PER_SHEET.measurements} measurements; delete one first.`
		);
	}
	// The guess carries notes for the preview; only the choice itself is stored.
	const choice = columnChoiceSchema.parse(result.columns);
	return store.createMeasurement({
		sheetId,
		userId: actor.id,
		name: name.data,
		fileName: upload.fileName || 'measurement.csv',
		columns: choice,
		curve: result.data,
		source: upload.bytes
	});
}

export async function renameMeasurementAs(actor: Actor, sheetId: string, id: string, name: string) {
	await authorizeSheet(actor, sheetId, 'save');
	const m = await store.renameMeasurement(sheetId, id, name);
	if (!m) throw new ApiProblem(404, 'Not found.');
	return m;
}

export async function deleteMeasurementAs(actor: Actor, sheetId: string, id: string) {
	await authorizeSheet(actor, sheetId, 'save');
	if (!(await store.deleteMeasurement(sheetId, id))) throw new ApiProblem(404, 'Not found.');
}
