// Liveness and readiness in one: the app version and whether PostgreSQL answers. A load
// balancer can take a process out of rotation on the 503.
import { json } from '@sveltejs/kit';
import { version } from '$app/environment';
import { databaseAnswers } from '$lib/server/db/connection';

export async function GET() {
	const dbOk = await databaseAnswers();
	const body = {
		service: 'polewise',
		version,
		database: dbOk ? 'ok' : 'unreachable',
		...(dbOk ? {} : { message: 'PostgreSQL does not answer; check DATABASE_URL and that the database server is running.' }),
		time: new Date().toISOString()
	};
	return json(body, { status: dbOk ? 200 : 503, headers: { 'cache-control': 'no-store' } });
}
