// The sheet file: our own versioned envelope around the network document (docs/network-format.md)
// and the canvas layout. Reading checks the document with the solver's own front door, so an
// import is refused with exactly the words the analyzer would use. Writing is canonical
// (canonical-json.ts): export → import → export gives the same bytes.
import { z } from 'zod';
import { SolverError, validateNetwork } from '../solver';
import { canonicalJson, type KeyOrder } from './canonical-json';

export const SHEET_FILE_FORMAT = 'polewise-sheet';
export const SHEET_FILE_VERSION = 1;
export const SHEET_FILE_MAX_BYTES = 2_000_000;
/** A compressed (.json.gz) sheet file may inflate to this much: a 100,000-element network. */
export const LARGE_SHEET_FILE_MAX_BYTES = 40_000_000;

export interface SheetFileContent {
	name: string;
	document: unknown;
	layout: unknown | null;
}

const ORDER: KeyOrder = {
	'': ['format', 'version', 'name', 'document', 'layout'],
	document: ['schema', 'title', 'elements', 'input', 'output', 'variants'],
	'document.elements.*': ['id', 'type', 'nodes', 'value', 'control'],
	'document.output': ['node', 'reference'],
	'document.variants': ['absent', 'groups'],
	'document.variants.groups.*': ['name', 'options'],
	'document.variants.groups.*.options.*': ['name', 'values', 'absent', 'present'],
	layout: ['format', 'version', 'input', 'items', 'wires'],
	'layout.items.*': ['id', 'kind', 'name', 'value', 'x', 'y', 'rotation', 'flip'],
	'layout.wires.*': ['id', 'from', 'to']
};

export function writeSheetFile(content: SheetFileContent): string {
	return canonicalJson(
		{
			format: SHEET_FILE_FORMAT,
			version: SHEET_FILE_VERSION,
			name: content.name,
			document: content.document,
			layout: content.layout ?? null
		},
		ORDER
	);
}

/** A file name safe on every system: the sheet name, letters, digits, dashes. */
export function fileStem(name: string): string {
	const stem = name
		.normalize('NFKD')
		.replace(/[^\w\s.-]+/g, '')
		.trim()
		.replace(/\s+/g, '-')
		.slice(0, 80);
	return stem || 'sheet';
}

export class SheetFileError extends Error {
	constructor(
		message: string,
		readonly details: { code?: string; element?: string; node?: string } = {}
	) {
		super(message);
		this.name = 'SheetFileError';
	}
}

const layoutSchema = z.object({
	format: z.literal('polewise-canvas', { error: 'layout.format must be "polewise-canvas"' }),
	version: z.literal(1, { error: 'layout.version must be 1' }),
	items: z.array(z.record(z.string(), z.unknown()), { error: 'layout.items must be a list' }),
	wires: z.array(z.record(z.string(), z.unknown()), { error: 'layout.wires must be a list' }),
	input: z.string().nullable().optional()
});

const envelopeSchema = z.object({
	format: z.literal(SHEET_FILE_FORMAT),
	version: z.number({ error: 'version must be a number' }),
	name: z
		.string({ error: 'name must be text' })
		.trim()
		.min(1, 'name is empty')
		.max(120, 'name is too long (at most 120 characters)'),
	document: z.unknown(),
	layout: z.unknown().optional()
});

/**
 * Read a sheet file (or a bare network document, which imports with an automatic layout).
 * `fallbackName` names a bare document (from its title or the uploaded file's name).
 */
export function readSheetFile(
	text: string,
	fallbackName = 'Imported sheet',
	maxBytes = SHEET_FILE_MAX_BYTES
): SheetFileContent {
	if (text.length > maxBytes) throw new SheetFileError(`the file is over ${maxBytes / 1_000_000} MB`);
	let data: unknown;
	try {
		data = JSON.parse(text.replace(/^\uFEFF/, ''));
	} catch (e) {
		throw new SheetFileError(`the file is not valid JSON (${(e as Error).message})`);
	}
	if (!data || typeof data !== 'object' || Array.isArray(data))
		throw new SheetFileError('the file is not a sheet file: expected a JSON object');
	const obj = data as Record<string, unknown>;
	let content: SheetFileContent;
	if ('format' in obj) {
		if (obj.format !== SHEET_FILE_FORMAT)
			throw new SheetFileError(
				`the file's format is "${String(obj.format)}", not "${SHEET_FILE_FORMAT}"`
			);
		const env = envelopeSchema.safeParse(obj);
		if (!env.success) throw new SheetFileError(env.error.issues[0].message);
		if (env.data.version > SHEET_FILE_VERSION) {
			throw new SheetFileError(
				`the file is version ${env.data.version} of the sheet format; this Polewise reads up to version ${SHEET_FILE_VERSION}`
			);
		}
		content = { name: env.data.name, document: env.data.document, layout: env.data.layout ?? null };
	} else if ('schema' in obj && 'elements' in obj) {
		const title =
			typeof obj.title === 'string' && obj.title.trim()
				? obj.title.trim().slice(0, 120)
				: fallbackName;
		content = { name: title, document: obj, layout: null };
	} else {
		throw new SheetFileError(
			`the file is neither a sheet file ("format": "${SHEET_FILE_FORMAT}") nor a network document ("schema": 1)`
		);
	}
	if (content.layout !== null) {
		const l = layoutSchema.safeParse(content.layout);
		if (!l.success) throw new SheetFileError(l.error.issues[0].message);
	}
	try {
		validateNetwork(content.document);
	} catch (e) {
		if (e instanceof SolverError) throw new SheetFileError(e.message, e.toJSON());
		throw e;
	}
	return content;
}
