// The design aids' connection to the server for one sheet. They work on the drawing as it is
// on the canvas now (unsaved edits too) when the page links an editable editor; otherwise
// (read-only viewers, pages without an editor) on the latest saved revision. Also: JSON calls
// with their error message kept for the panel that asked, and the sheet's stored settings.
import type { DesignSettings } from '$lib/network/design-schema';
import type { NetworkDocument, PartRole } from '$lib/network/schema';
import type { DrawingLink, DrawingNow, OptionValue } from '$lib/editor/drawing-link.svelte';
import { hasVariants, listVariants, resolveVariant, type VariantInfo } from '$lib/network/variants';

/** What a design aid ran on: the canvas (based on a saved revision) or a saved revision, and on
 * a sheet with variants which variant. */
export type DesignSource = (
	| { kind: 'drawing'; base: number; unsaved: boolean }
	| { kind: 'revision'; number: number }
) & { variant?: string };

export const sourceLabel = (s: DesignSource): string =>
	(s.kind === 'revision'
		? `saved revision ${s.number}`
		: s.unsaved
			? `the drawing as it is now (unsaved edits on revision ${s.base})`
			: `the drawing as it is now (saved as revision ${s.base})`) +
	(s.variant ? `, variant ${s.variant}` : '');

export interface CallError {
	message: string;
	element?: string;
}

export class DesignClient {
	readonly sheetId: string;
	readonly canEdit: boolean;
	readonly #link: DrawingLink | undefined;
	#saved = $state.raw<NetworkDocument | null>(null);
	revision = $state(0);
	settings = $state.raw<DesignSettings>({
		spec: {},
		tolerances: { elements: [], runs: 1000, seed: 1 }
	});

	constructor(sheetId: string, canEdit: boolean, link?: DrawingLink) {
		this.sheetId = sheetId;
		this.canEdit = canEdit;
		this.#link = link;
	}

	/** The editable drawing, when the aids work on it (null: they work on saved revisions). */
	get drawing(): DrawingNow | null {
		return (this.canEdit && this.#link?.now) || null;
	}

	/** The whole document the aids see now (variants included): the drawing, or the saved revision. */
	get fullDocument(): NetworkDocument | null {
		return this.drawing?.document ?? this.#saved;
	}

	/** The variant the aids run on: the one picked above the canvas, else the first. */
	get variant(): VariantInfo | null {
		const doc = this.fullDocument;
		if (!doc || !hasVariants(doc)) return null;
		try {
			const all = listVariants(doc);
			const picked = this.#link?.variant?.name;
			return all.find((v) => v.name === picked) ?? all[0] ?? null;
		} catch {
			return null;
		}
	}

	/** The network the aids see now: on a sheet with variants, the picked variant's. */
	get document(): NetworkDocument | null {
		const doc = this.fullDocument;
		return doc ? this.#resolve(doc) : null;
	}

	#resolve(doc: NetworkDocument): NetworkDocument {
		const v = this.variant;
		if (!v) return doc;
		try {
			return resolveVariant(doc, v) as NetworkDocument;
		} catch (e) {
			throw { message: (e as Error).message } satisfies CallError;
		}
	}

	/** Null until the saved revision is known when there is no drawing. */
	get source(): DesignSource | null {
		const d = this.drawing;
		const variant = this.variant?.name;
		if (d) return { kind: 'drawing', base: d.base, unsaved: d.unsaved, variant };
		return this.revision ? { kind: 'revision', number: this.revision, variant } : null;
	}

	/** The network to run an aid on, and what it is; refuses a drawing that cannot be analysed yet. */
	async network(): Promise<{ document: NetworkDocument; source: DesignSource }> {
		const d = this.drawing;
		if (!d) {
			const document = await this.refresh();
			return { document: this.#resolve(document), source: this.source! };
		}
		if (d.problem)
			throw { message: `The drawing cannot be analysed yet: ${d.problem}` } satisfies CallError;
		return { document: this.#resolve(d.document), source: this.source! };
	}

	/** Write values into the drawing as one undo step (autosave saves it); the names changed. */
	setValues(values: Record<string, number>): string[] {
		return this.drawing ? this.#link!.setValues(values) : [];
	}

	/** Write one part's value into variant options (one undo step); false without a drawing. */
	setOptionValues(element: string, values: OptionValue[]): boolean {
		return this.drawing ? this.#link!.setOptionValues(element, values) : false;
	}

	/** Elements whose value a design aid may change, in document order. */
	get adjustable(): { id: string; type: string; value?: string | number; role?: PartRole }[] {
		return (this.document?.elements ?? []).filter((e) =>
			['R', 'C', 'L', 'VCCS', 'VCVS', 'CCCS', 'CCVS'].includes(e.type)
		);
	}

	async refresh(): Promise<NetworkDocument> {
		const r = await this.call<{ revision: { number: number; document: NetworkDocument } }>(
			'GET',
			`/api/sheets/${this.sheetId}`
		);
		this.#saved = r.revision.document;
		this.revision = r.revision.number;
		return r.revision.document;
	}

	async loadSettings(): Promise<void> {
		this.settings = (
			await this.call<{ settings: DesignSettings }>(
				'GET',
				`/api/design/sheets/${this.sheetId}/settings`
			)
		).settings;
	}

	async saveSettings(next: DesignSettings): Promise<void> {
		this.settings = (
			await this.call<{ settings: DesignSettings }>(
				'PUT',
				`/api/design/sheets/${this.sheetId}/settings`,
				next
			)
		).settings;
	}

	/** POST with the network (the drawing, or the latest saved revision) added to the body. */
	async withDocument<T>(path: string, body: object): Promise<T & { source: DesignSource }> {
		const { document, source } = await this.network();
		return { ...(await this.call<T>('POST', path, { ...body, document })), source };
	}

	/**
	 * The same request on every variant's own network, one after another (the design worker runs
	 * one task at a time); each variant keeps its answer or its error.
	 */
	async forEveryVariant<T>(
		path: string,
		body: object | ((document: NetworkDocument) => object)
	): Promise<{ name: string; value: T | null; error: string | null }[]> {
		const d = this.drawing;
		if (d?.problem)
			throw { message: `The drawing cannot be analysed yet: ${d.problem}` } satisfies CallError;
		const doc = d ? d.document : await this.refresh();
		const out: { name: string; value: T | null; error: string | null }[] = [];
		for (const v of hasVariants(doc) ? listVariants(doc) : []) {
			try {
				const document = resolveVariant(doc, v) as NetworkDocument;
				const extra = typeof body === 'function' ? body(document) : body;
				out.push({ name: v.name, value: await this.call<T>('POST', path, { ...extra, document }), error: null });
			} catch (e) {
				out.push({ name: v.name, value: null, error: messageOf(e) });
			}
		}
		return out;
	}

	/** POST with the whole document, every variant included (for checks across the variants). */
	async withFullDocument<T>(path: string, body: object): Promise<T & { source: DesignSource }> {
		const d = this.drawing;
		if (d?.problem)
			throw { message: `The drawing cannot be analysed yet: ${d.problem}` } satisfies CallError;
		const document = d ? d.document : await this.refresh();
		const source: DesignSource = d
			? { kind: 'drawing', base: d.base, unsaved: d.unsaved }
			: { kind: 'revision', number: this.revision };
		return { ...(await this.call<T>('POST', path, { ...body, document })), source };
	}

	async call<T>(method: string, path: string, body?: unknown): Promise<T> {
		const res = await fetch(path, {
			method,
			headers: body === undefined ? {} : { 'content-type': 'application/json' },
			body: body === undefined ? undefined : JSON.stringify(body)
		});
		const data = await res.json().catch(() => ({}));
		if (!res.ok)
			throw {
				message: data.error ?? `the server answered ${res.status}`,
				element: data.element
			} satisfies CallError;
		return data as T;
	}
}

export const messageOf = (e: unknown): string =>
	typeof e === 'object' && e && 'message' in e ? String((e as CallError).message) : String(e);
