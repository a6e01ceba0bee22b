// GET/PUT /api/design/sheets/:id/settings — the sheet's spec limits and tolerances.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { saveSettingsOf, settingsOf } from '$lib/server/jobs/design-service';
import { designSettingsSchema } from '$lib/network/design-schema';

export const GET = endpoint(async (event) =>
	json({ settings: await settingsOf(apiActor(event), event.params.id!) })
);

export const PUT = endpoint(async (event) => {
	const actor = apiActor(event);
	const settings = await readBody(event.request, designSettingsSchema, 1_000_000);
	return json({ settings: await saveSettingsOf(actor, event.params.id!, settings) });
});
