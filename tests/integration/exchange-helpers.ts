// Calling the exchange routes with real uploads: a multipart form (as a browser sends it) or
// raw bytes, through the SvelteKit handlers against the real PostgreSQL.
import type { RequestEvent, RequestHandler } from '@sveltejs/kit';
import { person, network } from './support/fixtures';
import { createWorkspace } from '../../src/lib/server/db/workspaces';
import { createSheet } from '../../src/lib/server/db/sheets';

export type User = { id: string; email: string; name: string };

export interface Reply {
	status: number;
	headers: Headers;
	text: string;
	bytes: Buffer;
	json: any; // eslint-disable-line @typescript-eslint/no-explicit-any
}

export async function send(
	handler: RequestHandler,
	o: {
		user: User | null;
		params: Record<string, string>;
		method?: string;
		path?: string;
		form?: FormData;
		body?: BodyInit;
		headers?: Record<string, string>;
	}
): Promise<Reply> {
	const url = new URL(o.path ?? '/api/test', 'http://127.0.0.1:5173');
	const method = o.method ?? (o.form || o.body ? 'POST' : 'GET');
	const request = new Request(url, { method, body: o.form ?? o.body, headers: o.headers });
	const event = {
		request,
		url,
		params: o.params,
		locals: { user: o.user, session: null, auth: o.user ? 'session' : null },
		getClientAddress: () => '127.0.0.1',
		cookies: { get: () => undefined, getAll: () => [], set() {}, delete() {}, serialize: () => '' },
		fetch,
		setHeaders() {},
		route: { id: null }
	} as unknown as RequestEvent;
	const response = await handler(event);
	const bytes = Buffer.from(await response.arrayBuffer());
	const text = bytes.toString('utf8');
	let json = null;
	if ((response.headers.get('content-type') ?? '').includes('json')) json = JSON.parse(text);
	return { status: response.status, headers: response.headers, text, bytes, json };
}

export function fileForm(
	content: string | Uint8Array,
	name: string,
	fields: Record<string, string> = {}
): FormData {
	const form = new FormData();
	form.set(
		'file',
		new File([typeof content === 'string' ? content : new Uint8Array(content)], name)
	);
	for (const [k, v] of Object.entries(fields)) form.set(k, v);
	return form;
}

/** An owner, a viewer member and a sheet holding a 1 kΩ / 1 nF low-pass. */
export async function exchangeWorld(doc: unknown = network('1k')) {
	const owner = await person('Exchange owner');
	const outsider = await person('Exchange outsider');
	const workspace = await createWorkspace(owner.id, 'Bench 3 — bench checks');
	const { sheet } = await createSheet({
		userId: owner.id,
		workspaceId: workspace.id,
		name: 'Low-pass 160 kHz',
		document: doc
	});
	return { owner, outsider, workspace, sheet };
}

/** Two-ports with closed-form parameters for the Touchstone tests: a series R, a shunt C behind 1 kΩ. */
export const seriesR = (r: string) => ({
	schema: 1,
	elements: [
		{ id: 'Vg', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'Rs', type: 'R', nodes: ['in', 'out'], value: r }
	],
	input: 'Vg',
	output: { node: 'out' }
});
export const shuntC = {
	schema: 1,
	elements: [
		{ id: 'Vg', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'Rs', type: 'R', nodes: ['in', 'out'], value: '1k' },
		{ id: 'Cp', type: 'C', nodes: ['out', 'gnd'], value: '2.2n' }
	],
	input: 'Vg',
	output: { node: 'out' }
};
