// GET /api/sheets/:id/report.pdf[?revision=n] — the review report as a PDF download (the report
// page printed in headless Chromium, as the caller).
import { apiActor, endpoint } from '$lib/server/api/respond';
import { config } from '$lib/server/config';
import { fileStem } from '$lib/exchange';
import { printToPdf } from '$lib/server/exchange/pdf';
import { fileResponse } from '$lib/server/exchange/serve';
import { revisionFromQuery } from '$lib/server/exchange/stored-results';

export const GET = endpoint(async (event) => {
	// Check access here first: a caller who may not read the sheet never starts the printer.
	const { sheet, revision } = await revisionFromQuery(apiActor(event), event.params.id!, event.url);
	const pdf = await printToPdf({
		origin: config().reportOrigin ?? event.url.origin,
		path: `/sheets/${sheet.id}/report?revision=${revision.number}&print=1`,
		cookie: event.request.headers.get('cookie'),
		authorization: event.request.headers.get('authorization')
	});
	return fileResponse(
		pdf,
		'application/pdf',
		`${fileStem(sheet.name)}-r${revision.number}-report.pdf`
	);
});
