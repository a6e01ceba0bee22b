// A sheet's life through the API: create, list (sort, filter, pages), rename, duplicate, trash,
// restore, delete for good; and input that is too long, has control characters or markup.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { network, person } from './support/fixtures';
import { createWorkspace } from '../../src/lib/server/db/workspaces';
import * as workspaces from '../../src/routes/api/workspaces/+server';
import * as sheets from '../../src/routes/api/workspaces/[id=uuid]/sheets/+server';
import * as sheetRoute from '../../src/routes/api/sheets/[id=uuid]/+server';
import * as restore from '../../src/routes/api/sheets/[id=uuid]/restore/+server';
import * as duplicate from '../../src/routes/api/sheets/[id=uuid]/duplicate/+server';

useDatabase();

async function owner() {
	const ana = await person('Ana');
	const ws = await createWorkspace(ana.id, 'Bench');
	return { ana, ws };
}

const names = (body: { sheets: { name: string }[] }) => body.sheets.map((s) => s.name);

describe('sheet lifecycle', () => {
	it('lists with sort, a text filter (wildcards are literal) and pages with the total', async () => {
		const { ana, ws } = await owner();
		for (const name of ['Probe 10:1', 'Attenuator 50%', 'TIA 100k', 'Anti-alias 5th order', 'Attenuator 20 dB']) {
			expect((await call(sheets.POST, { user: ana, params: { id: ws.id }, method: 'POST', body: { name } })).status).toBe(201);
		}
		const list = (query: string) => call(sheets.GET, { user: ana, params: { id: ws.id }, path: `/api/workspaces/${ws.id}/sheets?${query}` });
		expect(names((await list('sort=name')).body)).toEqual(['Anti-alias 5th order', 'Attenuator 20 dB', 'Attenuator 50%', 'Probe 10:1', 'TIA 100k']);
		expect(names((await list('sort=name&dir=desc')).body)[0]).toBe('TIA 100k');
		expect(names((await list('q=attenuator&sort=name')).body)).toEqual(['Attenuator 20 dB', 'Attenuator 50%']);
		expect(names((await list('q=50%25')).body)).toEqual(['Attenuator 50%']);
		const page2 = (await list('sort=name&perPage=2&page=2')).body;
		expect(page2).toMatchObject({ total: 5, page: 2, perPage: 2 });
		expect(names(page2)).toEqual(['Attenuator 50%', 'Probe 10:1']);
		expect(page2.sheets[0].updatedByName).toBe('Ana');
		const bad = await list('sort=colour');
		expect(bad.status).toBe(400);
		expect(bad.body.error).toMatch(/^sort: /);
	});

	it('renames, duplicates, trashes, restores and deletes for good (only from the trash)', async () => {
		const { ana, ws } = await owner();
		const created = await call(sheets.POST, { user: ana, params: { id: ws.id }, method: 'POST', body: { name: 'Divider', document: network('9M') } });
		const id = created.body.sheet.id;
		expect((await call(sheetRoute.PATCH, { user: ana, params: { id }, method: 'PATCH', body: { name: '  Divider, trimmed  ' } })).body.sheet.name).toBe('Divider, trimmed');
		const copy = await call(duplicate.POST, { user: ana, params: { id }, method: 'POST', body: {} });
		expect(copy.status).toBe(201);
		expect(copy.body.sheet.name).toBe('Copy of Divider, trimmed');
		expect(copy.body.revision.document).toEqual(network('9M'));
		const early = await call(sheetRoute.DELETE, { user: ana, params: { id }, method: 'DELETE', path: `/api/sheets/${id}?permanent=1` });
		expect(early.status).toBe(409);
		expect(early.body.error).toMatch(/trash before deleting/);
		expect((await call(sheetRoute.DELETE, { user: ana, params: { id }, method: 'DELETE' })).body.sheet.trashedAt).not.toBeNull();
		const trashed = await call(sheets.GET, { user: ana, params: { id: ws.id }, path: `/api/workspaces/${ws.id}/sheets?trashed=1` });
		expect(names(trashed.body)).toEqual(['Divider, trimmed']);
		const renameTrashed = await call(sheetRoute.PATCH, { user: ana, params: { id }, method: 'PATCH', body: { name: 'x' } });
		expect(renameTrashed.status).toBe(409);
		expect((await call(restore.POST, { user: ana, params: { id }, method: 'POST' })).body.sheet.trashedAt).toBeNull();
		await call(sheetRoute.DELETE, { user: ana, params: { id }, method: 'DELETE' });
		expect((await call(sheetRoute.DELETE, { user: ana, params: { id }, method: 'DELETE', path: `/api/sheets/${id}?permanent=1` })).status).toBe(204);
		expect((await call(sheetRoute.GET, { user: ana, params: { id } })).status).toBe(404);
	});
});

describe('names and input', () => {
	it('refuses names that are too long, empty or hold line breaks, with a message naming the field', async () => {
		const { ana, ws } = await owner();
		const post = (name: unknown) => call(sheets.POST, { user: ana, params: { id: ws.id }, method: 'POST', body: { name } });
		const long = await post('R'.repeat(121));
		expect(long.status).toBe(400);
		expect(long.body.error).toBe('name: Sheet name is too long (at most 120 characters)');
		expect((await post('   ')).body.error).toBe('name: Sheet name is required');
		expect((await post('two\nlines')).body.error).toBe('name: Sheet name may not contain control characters or line breaks');
		const ws2 = await call(workspaces.POST, { user: ana, method: 'POST', body: { name: 'W'.repeat(101) } });
		expect(ws2.body.error).toBe('name: Workspace name is too long (at most 100 characters)');
	});

	it('keeps markup in a name as plain text (rendered escaped by the pages)', async () => {
		const { ana, ws } = await owner();
		const name = '<img src=x onerror=alert(1)> & "divider"';
		const created = await call(sheets.POST, { user: ana, params: { id: ws.id }, method: 'POST', body: { name } });
		expect(created.status).toBe(201);
		const read = await call(sheetRoute.GET, { user: ana, params: { id: created.body.sheet.id } });
		expect(read.body.sheet.name).toBe(name);
		// Svelte escapes text nodes: server-render the element table's caption path with the name.
		const { render } = await import('svelte/server');
		const RoleBadge = (await import('../../src/lib/components/sharing/role-badge.svelte')).default;
		const html = render(RoleBadge, { props: { role: name } }).body;
		expect(html).not.toContain('<img');
		expect(html).toContain('&lt;img');
	});

	it('rejects a body over the small-request limit with 413', async () => {
		const { ana, ws } = await owner();
		const result = await call(workspaces.POST, { user: ana, method: 'POST', rawBody: JSON.stringify({ name: 'x', pad: 'y'.repeat(20_000) }) });
		expect(result.status).toBe(413);
		expect((await call(sheets.GET, { user: ana, params: { id: ws.id } })).status).toBe(200);
	});
});
