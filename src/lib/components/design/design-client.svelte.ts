// The design aids' connection to the server for one sheet: the latest saved document (design
// aids work on what is saved, so every figure belongs to a revision), JSON calls with their
// error message kept for the panel that asked, and the sheet's stored settings.
import type { DesignSettings } from '$lib/network/design-schema';
import type { NetworkDocument } from '$lib/network/schema';

export interface CallError {
	message: string;
	element?: string;
}

export class DesignClient {
	readonly sheetId: string;
	readonly canEdit: boolean;
	document = $state.raw<NetworkDocument | null>(null);
	revision = $state(0);
	settings = $state.raw<DesignSettings>({
		spec: {},
		tolerances: { elements: [], runs: 1000, seed: 1 }
	});

	constructor(sheetId: string, canEdit: boolean) {
		this.sheetId = sheetId;
		this.canEdit = canEdit;
	}

	/** Elements whose value a design aid may change, in document order. */
	get adjustable(): { id: string; type: string; value?: string | number }[] {
		return (this.document?.elements ?? []).filter((e) =>
			['R', 'C', 'L', 'VCCS', 'VCVS', 'CCCS', 'CCVS'].includes(e.type)
		);
	}

	async refresh(): Promise<NetworkDocument> {
		const r = await this.call<{ revision: { number: number; document: NetworkDocument } }>(
			'GET',
			`/api/sheets/${this.sheetId}`
		);
		this.document = r.revision.document;
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

	/** POST with the latest saved document added to the body. */
	async withDocument<T>(path: string, body: object): Promise<T> {
		const document = await this.refresh();
		return this.call<T>('POST', path, { ...body, document });
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
