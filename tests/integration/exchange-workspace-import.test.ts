// The workspace page's "import a sheet file" form action (?/import) against the real database:
// an exported sheet file or a bare network document becomes a new sheet of the workspace; a
// refusal carries the analyzer's own words (naming the element or node) or names the field, and
// no sheet is created; only people who may create sheets there may import.
import { isHttpError, isRedirect, type RequestEvent } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { exchangeWorld, fileForm, type User } from './exchange-helpers';
import { network } from './support/fixtures';
import { actions } from '../../src/routes/(app)/workspaces/[id=uuid]/+page.server';
import { getRevision, listSheets } from '../../src/lib/server/db/sheets';
import { exportSheetAs } from '../../src/lib/server/exchange/transfer-actions';
import { SolverError, validateNetwork } from '../../src/lib/solver';

useDatabase();

type Failure = {
	status: number;
	data: {
		section: string;
		message: string;
		errors: Record<string, string>;
		values: Record<string, string>;
	};
};

/** Run ?/import as the browser's form would post it; a redirect or an HTTP error comes back as data. */
async function importAs(user: User, workspaceId: string, form: FormData) {
	const url = new URL(`http://127.0.0.1:5173/workspaces/${workspaceId}?/import`);
	const event = {
		request: new Request(url, { method: 'POST', body: form }),
		url,
		params: { id: workspaceId },
		locals: { user, session: null, auth: 'session' },
		getClientAddress: () => '127.0.0.1',
		cookies: { get: () => undefined, getAll: () => [], set() {}, delete() {} },
		route: { id: '/(app)/workspaces/[id=uuid]' }
	} as unknown as RequestEvent;
	try {
		return { failure: (await actions.import(event as never)) as unknown as Failure };
	} catch (e) {
		if (isRedirect(e)) return { redirect: e };
		if (isHttpError(e)) return { httpError: e };
		throw e;
	}
}

const analyzerMessage = (doc: unknown) => {
	try {
		validateNetwork(doc);
	} catch (e) {
		if (e instanceof SolverError) return e.message;
	}
	return 'no error';
};

describe('workspace page: import a sheet file', () => {
	it('an exported sheet file becomes a new sheet of the workspace (document, layout, name) and the page goes to it', async () => {
		const { owner, workspace, sheet } = await exchangeWorld();
		const { text } = await exportSheetAs(
			{ kind: 'user', id: owner.id },
			sheet.id,
			new URL('http://x/')
		);
		const r = await importAs(owner, workspace.id, fileForm(text, 'low-pass-r1.polewise.json'));
		expect(r.redirect?.status).toBe(303);
		const sheets = await listSheets(workspace.id);
		expect(sheets).toHaveLength(2);
		const copy = sheets.find((s) => s.id !== sheet.id)!;
		expect(r.redirect?.location).toBe(`/sheets/${copy.id}`);
		expect(copy.name).toBe('Low-pass 160 kHz');
		const [a, b] = await Promise.all([getRevision(sheet.id), getRevision(copy.id)]);
		expect(b!.document).toEqual(a!.document);
		expect(b!.layout ?? null).toEqual(a!.layout ?? null);
	});

	it('a bare network document imports too, named by the name field (else its title)', async () => {
		const { owner, workspace } = await exchangeWorld();
		const named = await importAs(
			owner,
			workspace.id,
			fileForm(JSON.stringify(network('4.7k')), 'rc.json', { name: 'Bench RC, 4.7 k' })
		);
		expect(named.redirect?.status).toBe(303);
		const titled = await importAs(
			owner,
			workspace.id,
			fileForm(JSON.stringify({ ...network('10k'), title: 'Anti-alias 10 k' }), 'x.json')
		);
		expect(titled.redirect?.status).toBe(303);
		const names = (await listSheets(workspace.id)).map((s) => s.name).sort();
		expect(names).toEqual(['Anti-alias 10 k', 'Bench RC, 4.7 k', 'Low-pass 160 kHz']);
	});

	it.each([
		[
			'a bad element value',
			{
				...network('1k'),
				elements: [
					network('1k').elements[0],
					{ id: 'R1', type: 'R', nodes: ['a', 'b'], value: 'abc' },
					network('1k').elements[2]
				]
			},
			'R1'
		],
		['an unknown output node', { ...network('1k'), output: { node: 'zz' } }, 'zz']
	])(
		'refuses %s with the analyzer’s own message naming it; nothing is created',
		async (_what, doc, named) => {
			const { owner, workspace } = await exchangeWorld();
			const r = await importAs(
				owner,
				workspace.id,
				fileForm(JSON.stringify(doc), 'bad.json', { name: 'Keep me' })
			);
			expect(r.failure?.status).toBe(422);
			const words = analyzerMessage(doc);
			expect(words).toContain(named);
			expect(r.failure?.data).toMatchObject({ section: 'import', values: { name: 'Keep me' } });
			expect(r.failure?.data.errors.file).toBe(
				`The file was not imported: ${words.replace(/\.$/, '')}.`
			);
			expect(await listSheets(workspace.id)).toHaveLength(1);
		}
	);

	it('names the field: no file chosen (400), not JSON (422), a name that is too long (400); nothing is created', async () => {
		const { owner, workspace } = await exchangeWorld();
		const empty = await importAs(owner, workspace.id, fileForm('', ''));
		expect(empty.failure?.status).toBe(400);
		expect(empty.failure?.data.errors.file).toBe('Choose a sheet file (.json) to import.');
		const notJson = await importAs(owner, workspace.id, fileForm('{ "schema": 1, ', 'half.json'));
		expect(notJson.failure?.status).toBe(422);
		expect(notJson.failure?.data.errors.file).toMatch(
			/^The file was not imported: the file is not valid JSON/
		);
		const png = await importAs(
			owner,
			workspace.id,
			fileForm(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]), 'sheet.json')
		);
		expect(png.failure?.status).toBe(415);
		const long = await importAs(
			owner,
			workspace.id,
			fileForm(JSON.stringify(network('1k')), 'rc.json', { name: 'x'.repeat(121) })
		);
		expect(long.failure?.status).toBe(400);
		expect(Object.keys(long.failure!.data.errors)).toEqual(['name']);
		expect(await listSheets(workspace.id)).toHaveLength(1);
	});

	it('someone outside the workspace gets 404 (as for creating a sheet) and nothing is created', async () => {
		const { outsider, workspace } = await exchangeWorld();
		const r = await importAs(
			outsider,
			workspace.id,
			fileForm(JSON.stringify(network('1k')), 'rc.json')
		);
		expect(r.httpError?.status).toBe(404);
		expect(await listSheets(workspace.id)).toHaveLength(1);
	});
});
