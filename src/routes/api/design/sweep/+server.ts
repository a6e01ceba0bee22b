// POST /api/design/sweep — one element (or two on a grid) over a range: poles, zeros and the
// figures at each point. ?format=csv answers the same table as CSV.
import { json } from '@sveltejs/kit';
import { metricsCsv } from '$lib/design/table';
import type { SweepResult } from '$lib/design/sweep';
import { designEndpoint } from '../handler';
import { sweepBody } from '../schema';

export const POST = designEndpoint(
	sweepBody,
	(body, document) => ({
		kind: 'sweep',
		document,
		request: { axes: body.axes, band: body.band ?? null, inputAt: body.inputAt ?? null }
	}),
	(value, url) => {
		const r = value as SweepResult;
		if (url.searchParams.get('format') !== 'csv') return json(r);
		return new Response(metricsCsv(r.elements, r.rows), {
			headers: {
				'content-type': 'text/csv; charset=utf-8',
				'content-disposition': 'attachment; filename="sweep.csv"'
			}
		});
	}
);
