// Attachments and sheet files through the routes: type decided by content, 413/415 with nothing
// stored, safe headers on the way out; export → import → export byte-stable after one
// normalization; imports refused with the analyzer's own message.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { exchangeWorld, fileForm, send } from './exchange-helpers';
import * as attachments from '../../src/routes/api/sheets/[id=uuid]/attachments/+server';
import * as attachment from '../../src/routes/api/sheets/[id=uuid]/attachments/[attachmentId=uuid]/+server';
import * as exportRoute from '../../src/routes/api/sheets/[id=uuid]/export/+server';
import * as importRoute from '../../src/routes/api/sheets/import/+server';
import { countAttachments } from '../../src/lib/server/db/attachments';
import { getRevision, listSheets, saveRevision } from '../../src/lib/server/db/sheets';
import { db } from '../../src/lib/server/db/connection';
import { addMember, updateWorkspace } from '../../src/lib/server/db/workspaces';
import { person } from './support/fixtures';

useDatabase();

const PNG = Buffer.concat([
	Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex'),
	Buffer.alloc(40)
]);
const PDF = Buffer.from(
	'%PDF-1.4\n%\xe2\xe3\xcf\xd3\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n',
	'latin1'
);

describe('attachments', () => {
	it('stores a PNG and a PDF, serves them as downloads with nosniff and a sandbox; images inline on request', async () => {
		const { owner, sheet } = await exchangeWorld();
		const png = await send(attachments.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm(PNG, 'scope shot.png')
		});
		expect(png.status, png.text).toBe(201);
		expect(png.json.attachment).toMatchObject({
			fileName: 'scope shot.png',
			contentType: 'image/png',
			byteSize: PNG.length
		});
		const pdf = await send(attachments.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm(PDF, 'datasheet.pdf')
		});
		expect(pdf.json.attachment.contentType).toBe('application/pdf');
		const got = await send(attachment.GET, {
			user: owner,
			params: { id: sheet.id, attachmentId: pdf.json.attachment.id }
		});
		expect(got.bytes.equals(PDF)).toBe(true);
		expect(got.headers.get('content-type')).toBe('application/pdf');
		expect(got.headers.get('content-disposition')).toMatch(/^attachment; filename="datasheet.pdf"/);
		expect(got.headers.get('x-content-type-options')).toBe('nosniff');
		expect(got.headers.get('content-security-policy')).toContain('sandbox');
		// A PDF is never shown inline; an image may be.
		const pdfInline = await send(attachment.GET, {
			user: owner,
			params: { id: sheet.id, attachmentId: pdf.json.attachment.id },
			path: '/x?inline=1'
		});
		expect(pdfInline.headers.get('content-disposition')).toMatch(/^attachment;/);
		const pngInline = await send(attachment.GET, {
			user: owner,
			params: { id: sheet.id, attachmentId: png.json.attachment.id },
			path: '/x?inline=1'
		});
		expect(pngInline.headers.get('content-disposition')).toMatch(/^inline;/);
		const listed = await send(attachments.GET, { user: owner, params: { id: sheet.id } });
		expect(listed.json.attachments.map((a: { fileName: string }) => a.fileName)).toEqual([
			'scope shot.png',
			'datasheet.pdf'
		]);
	});

	it.each([
		[
			'HTML named .png',
			Buffer.from('<html><script>alert(1)</script></html>'),
			'photo.png',
			/content is none of them/
		],
		[
			'an SVG (script-capable) image',
			Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
			'plot.svg',
			/content is none of them/
		],
		['a PDF named .png', PDF, 'photo.png', /named "photo.png" but its content is application\/pdf/],
		[
			'an executable named .pdf',
			Buffer.from('7f454c46020101000000', 'hex'),
			'datasheet.pdf',
			/content is none of them/
		]
	])('415 for %s, nothing stored', async (_name, bytes, name, message) => {
		const { owner, sheet } = await exchangeWorld();
		const r = await send(attachments.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm(bytes, name)
		});
		expect(r.status).toBe(415);
		expect(r.json.error).toMatch(message);
		expect(await countAttachments(sheet.id)).toBe(0);
	});

	it('413 for a file over 5 MB (multipart and raw, declared or not), nothing stored', async () => {
		const { owner, sheet } = await exchangeWorld();
		const big = Buffer.concat([PNG, Buffer.alloc(5 * 1024 * 1024)]);
		const multipart = await send(attachments.POST, {
			user: owner,
			params: { id: sheet.id },
			form: fileForm(big, 'big.png')
		});
		expect(multipart.status).toBe(413);
		const raw = await send(attachments.POST, {
			user: owner,
			params: { id: sheet.id },
			body: big,
			path: '/x?name=big.png',
			headers: { 'content-type': 'application/octet-stream' }
		});
		expect(raw.status).toBe(413);
		expect(raw.json.error).toMatch(/over the 5 MB upload limit/);
		expect(await countAttachments(sheet.id)).toBe(0);
	});

	it('a commenter attaches a file to a comment (not to the sheet); it is listed with that comment', async () => {
		const { owner, workspace, sheet } = await exchangeWorld();
		const reviewer = await person('Comment reviewer');
		await addMember(workspace.id, reviewer.id, 'member');
		await updateWorkspace(workspace.id, { defaultSheetRole: 'commenter' });
		const [[comment]] = (await db().query(
			`INSERT INTO comments (id, sheet_id, author_id, revision_number, anchor_kind, anchor_ref, body, body_html, mentions, created_at)
			 VALUES (gen_random_uuid(), :sheet, :author, 1, 'element', 'C1', 'see the scope shot', '<p>see the scope shot</p>', '[]', now()) RETURNING id`,
			{ replacements: { sheet: sheet.id, author: reviewer.id } }
		)) as [[{ id: string }], unknown];
		// A commenter may not attach to the sheet itself (that needs the right to change it)…
		expect(
			(
				await send(attachments.POST, {
					user: reviewer,
					params: { id: sheet.id },
					form: fileForm(PNG, 'shot.png')
				})
			).status
		).toBe(403);
		// …but may attach to a comment.
		const r = await send(attachments.POST, {
			user: reviewer,
			params: { id: sheet.id },
			form: fileForm(PNG, 'shot.png', { commentId: comment.id })
		});
		expect(r.status, r.text).toBe(201);
		expect(r.json.attachment.commentId).toBe(comment.id);
		const onComment = await send(attachments.GET, {
			user: owner,
			params: { id: sheet.id },
			path: `/x?comment=${comment.id}`
		});
		expect(onComment.json.attachments.map((a: { fileName: string }) => a.fileName)).toEqual([
			'shot.png'
		]);
		expect(
			(await send(attachments.GET, { user: owner, params: { id: sheet.id } })).json.attachments
		).toEqual([]);
		const missing = await send(attachments.POST, {
			user: reviewer,
			params: { id: sheet.id },
			form: fileForm(PNG, 'x.png', { commentId: '00000000-0000-4000-8000-000000000000' })
		});
		expect(missing.status).toBe(404);
	});

	it('the list tells the upload limit (POLEWISE_UPLOAD_LIMIT_BYTES, default 5 MB) so a browser can check before sending', async () => {
		const { owner, sheet } = await exchangeWorld();
		const list = () =>
			send(attachments.GET, { user: owner, params: { id: sheet.id }, path: '/x?comment=all' });
		expect((await list()).json.uploadLimitBytes).toBe(5 * 1024 * 1024);
		process.env.POLEWISE_UPLOAD_LIMIT_BYTES = String(2 * 1024 * 1024);
		try {
			expect((await list()).json.uploadLimitBytes).toBe(2 * 1024 * 1024);
		} finally {
			delete process.env.POLEWISE_UPLOAD_LIMIT_BYTES;
		}
	});

	it('outsiders get 404; signed-out callers 401', async () => {
		const { outsider, sheet } = await exchangeWorld();
		expect(
			(
				await send(attachments.POST, {
					user: outsider,
					params: { id: sheet.id },
					form: fileForm(PNG, 'a.png')
				})
			).status
		).toBe(404);
		expect((await send(attachments.GET, { user: null, params: { id: sheet.id } })).status).toBe(
			401
		);
	});
});

const probe = {
	schema: 1,
	title: 'Probe 10:1',
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rsrc', type: 'R', nodes: ['src', 'a'], value: '50' },
		{ id: 'Rt', type: 'R', nodes: ['a', 'b'], value: '9M' },
		{ id: 'Ct', type: 'C', nodes: ['a', 'b'], value: '10p' },
		{ id: 'Rin', type: 'R', nodes: ['b', 'gnd'], value: 1e6 },
		{ id: 'Cin', type: 'C', nodes: ['b', 0], value: '90p' }
	],
	input: 'Vin',
	output: { node: 'b', reference: 'gnd' }
};
const layout = {
	format: 'polewise-canvas',
	version: 1,
	input: 'i1',
	items: [
		{
			id: 'i1',
			kind: 'V',
			name: 'Vin',
			value: '1',
			x: 0,
			y: 0,
			rotation: 0,
			flip: false,
			notes: 'bench generator'
		}
	],
	wires: []
};

describe('sheet export and import', () => {
	it('round trip: export → import → export gives the same bytes, and the import holds everything', async () => {
		const { owner, workspace, sheet } = await exchangeWorld(probe);
		await saveRevision(owner.id, sheet.id, { document: probe, layout }, 1);
		const first = await send(exportRoute.GET, { user: owner, params: { id: sheet.id } });
		expect(first.status).toBe(200);
		expect(first.headers.get('content-disposition')).toMatch(
			/attachment; filename="Low-pass-160-kHz-r2.polewise.json"/
		);
		const imported = await send(importRoute.POST, {
			user: owner,
			params: {},
			form: fileForm(first.text, 'x.json', { workspaceId: workspace.id })
		});
		expect(imported.status, imported.text).toBe(201);
		const copy = imported.json.sheet;
		expect(copy.name).toBe('Low-pass 160 kHz');
		const second = await send(exportRoute.GET, { user: owner, params: { id: copy.id } });
		expect(second.text.replace('-r1.', '-r2.')).toBe(first.text);
		const stored = await getRevision(copy.id);
		expect(stored!.document).toEqual(probe);
		expect(stored!.layout).toEqual(layout);
	});

	it('normalizes once: a hand-written file with other key order and spacing exports canonically, and stays so', async () => {
		const { owner, workspace } = await exchangeWorld();
		const messy = `{"layout":null,"document":${JSON.stringify({ output: probe.output, input: 'Vin', elements: probe.elements, schema: 1 })},"name":"Hand made","version":1,"format":"polewise-sheet"}`;
		const a = await send(importRoute.POST, {
			user: owner,
			params: {},
			form: fileForm(messy, 'hand.json', { workspaceId: workspace.id })
		});
		const e1 = await send(exportRoute.GET, { user: owner, params: { id: a.json.sheet.id } });
		expect(e1.text).not.toBe(messy);
		const b = await send(importRoute.POST, {
			user: owner,
			params: {},
			form: fileForm(e1.text, 'again.json', { workspaceId: workspace.id })
		});
		const e2 = await send(exportRoute.GET, { user: owner, params: { id: b.json.sheet.id } });
		expect(e2.text).toBe(e1.text);
	});

	it.each([
		[
			'a value the analyzer refuses',
			{
				...probe,
				elements: [
					...probe.elements.slice(0, 5),
					{ id: 'Cin', type: 'C', nodes: ['b', 'gnd'], value: '10pp' }
				]
			},
			{ code: 'bad_value', element: 'Cin' }
		],
		[
			'an output node that does not exist',
			{ ...probe, output: { node: 'zz' } },
			{ code: 'unknown_output_node' }
		],
		[
			'a duplicate id',
			{ ...probe, elements: [...probe.elements, probe.elements[1]] },
			{ code: 'duplicate_id', element: 'Rsrc' }
		]
	])('refuses %s with the analyzer’s message; no sheet is made', async (_name, doc, want) => {
		const { owner, workspace } = await exchangeWorld();
		const r = await send(importRoute.POST, {
			user: owner,
			params: {},
			form: fileForm(JSON.stringify(doc), 'bad.json', { workspaceId: workspace.id })
		});
		expect(r.status).toBe(422);
		expect(r.json).toMatchObject(want);
		const { validateNetwork, SolverError } = await import('../../src/lib/solver');
		let expected = '';
		try {
			validateNetwork(doc);
		} catch (e) {
			if (e instanceof SolverError) expected = e.message;
		}
		expect(r.json.error).toBe(expected);
		expect(await listSheets(workspace.id)).toHaveLength(1);
	});

	it('imports only into a workspace the caller belongs to (404 otherwise)', async () => {
		const { outsider, workspace } = await exchangeWorld();
		const r = await send(importRoute.POST, {
			user: outsider,
			params: {},
			form: fileForm(JSON.stringify(probe), 'p.json', { workspaceId: workspace.id })
		});
		expect(r.status).toBe(404);
	});
});
