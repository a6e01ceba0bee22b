// Malformed ids anywhere in a request are the caller's mistake: a 400 that names the parameter,
// never a 500 (issue 14 found 25 such 500s among 375 injection-shaped values, among them
// `GET /api/sheets/:id/attachments?comment=x`, reachable by a guest viewer, and an upload with a
// commentId of 36 hyphens). This walks every JSON API route with junk in each id-shaped query
// parameter and body field, as the sheet's owner (so access checks pass and the value reaches
// the data layer), and checks the routing fallback for junk path ids.
import { describe, expect, it } from 'vitest';
import type { RequestHandler } from '@sveltejs/kit';
import { randomUUID } from 'node:crypto';
import { useDatabase } from './support/database';
import { matrixWorld } from './support/fixtures';
import { call } from './support/handlers';
import * as attachments from '../../src/routes/api/sheets/[id=uuid]/attachments/+server';
import * as fallback from '../../src/routes/api/[...path]/+server';

useDatabase();

const JUNK = ['x', '-'.repeat(36), '00000000-0000-0000-0000-00000000000g'];
const ID_NAMES = [
	'comment',
	'commentId',
	'workspaceId',
	'sheetId',
	'userId',
	'parentId',
	'itemId',
	'requestId',
	'measurementId',
	'attachmentId',
	'linkId',
	'invitationId',
	'id'
];

// Streams never end and the PDF starts a browser: they take the same ids through the same code.
const SKIP = /\/(events|report\.pdf)\/\+server\.ts$/;
const modules = import.meta.glob<Record<string, RequestHandler>>(
	'../../src/routes/api/**/+server.ts',
	{ eager: true }
);

/** Like support/handlers' call, for any answer: the status and, when the answer is JSON, its body. */
async function send(handler: RequestHandler, options: Parameters<typeof call>[1] & object) {
	let status = 0;
	const wrapped: RequestHandler = async (event) => {
		const response = await handler(event);
		status = response.status;
		const json = (response.headers.get('content-type') ?? '').includes('json');
		return new Response(json ? await response.text() : 'null', { status });
	};
	return call(wrapped, options);
}

describe('junk ids', () => {
	it('no route answers 500 to a malformed id in the query or the body; a 400 names the parameter', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const failures: string[] = [];
		for (const [file, mod] of Object.entries(modules)) {
			if (SKIP.test(file) || file.includes('[...path]')) continue;
			const route = file.replace(/^.*src\/routes/, '').replace(/\/\+server\.ts$/, '');
			const params: Record<string, string> = {};
			for (const [, name, kind] of route.matchAll(/\[(\w+)(?:=(\w+))?\]/g)) {
				params[name] =
					kind === 'uuid'
						? name === 'id'
							? route.startsWith('/api/workspaces')
								? world.workspace.id
								: route.startsWith('/api/sheets')
									? sheet.id
									: randomUUID()
							: randomUUID()
						: kind === 'revision'
							? '1'
							: kind === 'token'
								? 'a'.repeat(52)
								: 'poles.csv';
			}
			const path = route.replace(/\[(\w+)(?:=\w+)?\]/g, (_, n) => params[n]);
			for (const method of ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const) {
				const handler = mod[method];
				if (!handler) continue;
				for (const junk of JUNK) {
					for (const name of ID_NAMES) {
						const tries = [
							{ path: `${path}?${name}=${encodeURIComponent(junk)}`, body: undefined as unknown }
						];
						if (method !== 'GET') tries.push({ path, body: { [name]: junk } });
						for (const t of tries) {
							let result;
							try {
								result = await send(handler, {
									user: world.owner,
									params,
									method,
									path: t.path,
									body: t.body
								});
							} catch (e) {
								failures.push(
									`${method} ${t.path} ${JSON.stringify(t.body ?? '')}: threw ${(e as Error).message.slice(0, 120)}`
								);
								continue;
							}
							if (result.status >= 500)
								failures.push(
									`${method} ${t.path} ${JSON.stringify(t.body ?? '')}: ${result.status}`
								);
							else if (result.body?.code === 'bad_value')
								failures.push(`${method} ${t.path} ${JSON.stringify(t.body ?? '')}: unnamed 400`);
						}
					}
				}
			}
		}
		expect(failures).toEqual([]);
	}, 120_000);

	it('names the parameter: ?comment=x on the attachment list (a guest viewer can send it)', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		for (const junk of ['x', '-'.repeat(36)]) {
			const r = await call(attachments.GET, {
				user: world.viewer,
				params: { id: sheet.id },
				path: `/api/sheets/${sheet.id}/attachments?comment=${junk}`
			});
			expect(r.status).toBe(400);
			expect(r.body.error).toMatch(/^comment: /);
			expect(r.body.issues).toEqual([{ field: 'comment', message: 'not an id (a UUID)' }]);
		}
		// "all" and a real (if unknown) id still work.
		expect(
			(
				await call(attachments.GET, {
					user: world.viewer,
					params: { id: sheet.id },
					path: `/api/sheets/${sheet.id}/attachments?comment=all`
				})
			).status
		).toBe(200);
		expect(
			(
				await call(attachments.GET, {
					user: world.viewer,
					params: { id: sheet.id },
					path: `/api/sheets/${sheet.id}/attachments?comment=${randomUUID()}`
				})
			).status
		).toBe(200);
	});

	it('a junk id in a path is a 400 naming the path parameter; an unknown address a JSON 404', async () => {
		const probe = async (path: string) => {
			const segments = path.replace(/^\/api\//, '');
			return call(fallback.fallback, { params: { path: segments }, path });
		};
		const r = await probe('/api/sheets/not-an-id/attachments');
		expect(r.status).toBe(400);
		expect(r.body.error).toMatch(/^id: "not-an-id" is not an id/);
		const deep = await probe(`/api/sheets/${randomUUID()}/comments/${'-'.repeat(36)}`);
		expect(deep.status).toBe(400);
		expect(deep.body.error).toMatch(/^commentId: /);
		expect((await probe('/api/sheets/x/revisions/0')).body.error).toMatch(/^id: /);
		expect((await probe(`/api/sheets/${randomUUID()}/revisions/0`)).body.error).toMatch(/^n: /);
		const unknown = await probe('/api/no-such-thing');
		expect(unknown.status).toBe(404);
		expect(unknown.body.error).toMatch(/No such API address/);
	});
});
