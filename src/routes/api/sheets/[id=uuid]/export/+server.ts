// GET /api/sheets/:id/export[?revision=n] — the sheet file (network + canvas layout) as a download.
import { apiActor, endpoint } from '$lib/server/api/respond';
import { fileStem } from '$lib/exchange';
import { fileResponse } from '$lib/server/exchange/serve';
import { exportSheetAs } from '$lib/server/exchange/transfer-actions';

export const GET = endpoint(async (event) => {
	const { sheet, revision, text } = await exportSheetAs(
		apiActor(event),
		event.params.id!,
		event.url
	);
	return fileResponse(
		text,
		'application/json; charset=utf-8',
		`${fileStem(sheet.name)}-r${revision.number}.polewise.json`
	);
});
