// The sheet's measured responses on the client: the list with curves, which ones are overlaid
// on the response plot, and the band for the deviation read-out. Shared with the results panels
// through context so the plot can draw overlays without the page passing them down.
import { getContext, setContext } from 'svelte';
import { SvelteSet } from 'svelte/reactivity';
import type { ColumnChoice } from '$lib/exchange';

export interface MeasurementItem {
	id: string;
	name: string;
	fileName: string;
	points: number;
	fMin: number;
	fMax: number;
	hasPhase: boolean;
	createdByName: string | null;
	createdAt: string;
	curve: { f: number[]; magnitudeDb: number[]; phaseDeg: number[] | null };
}

/** What the response plot needs per overlay; `mark` is the marker shape (not only colour). */
export interface Overlay {
	id: string;
	name: string;
	f: number[];
	magnitudeDb: number[];
	/** Measured phase in degrees, when the file had a phase column. */
	phaseDeg?: number[] | null;
	mark: 'circle' | 'square' | 'triangle' | 'diamond';
	tone: 'caution' | 'fault' | 'pass' | 'ink';
}

const MARKS: Overlay['mark'][] = ['circle', 'square', 'triangle', 'diamond'];
const TONES: Overlay['tone'][] = ['caution', 'fault', 'pass', 'ink'];

export class UploadError extends Error {
	constructor(
		message: string,
		readonly row: number | null = null,
		readonly column: number | null = null
	) {
		super(message);
	}
}

export class ExchangeState {
	items = $state.raw<MeasurementItem[]>([]);
	readonly hidden = new SvelteSet<string>();
	band = $state<{ fMin: number | null; fMax: number | null }>({ fMin: null, fMax: null });
	loaded = $state(false);
	error = $state<string | null>(null);

	sheetId = $state('');

	/** Show another sheet's measurements (the page component is reused between sheets). */
	open(sheetId: string): void {
		if (sheetId === this.sheetId) return;
		this.sheetId = sheetId;
		this.items = [];
		this.hidden.clear();
		this.loaded = false;
		void this.load();
	}

	get base() {
		return `/api/sheets/${this.sheetId}`;
	}

	/** Overlays in list order; each keeps its marker and tone even while others are hidden. */
	get overlays(): Overlay[] {
		return this.items.flatMap((m, i) =>
			this.hidden.has(m.id)
				? []
				: [
						{
							id: m.id,
							name: m.name,
							f: m.curve.f,
							magnitudeDb: m.curve.magnitudeDb,
							phaseDeg: m.curve.phaseDeg,
							mark: MARKS[i % 4],
							tone: TONES[Math.floor(i / 4) % 4]
						}
					]
		);
	}

	styleOf(id: string): Pick<Overlay, 'mark' | 'tone'> {
		const i = Math.max(
			0,
			this.items.findIndex((m) => m.id === id)
		);
		return { mark: MARKS[i % 4], tone: TONES[Math.floor(i / 4) % 4] };
	}

	async load(): Promise<void> {
		const id = this.sheetId;
		const r = await fetch(`${this.base}/measurements?curves=1`);
		if (id !== this.sheetId) return; // another sheet was opened meanwhile
		if (!r.ok) {
			this.error =
				(await r.json().catch(() => null))?.error ??
				`Measurements could not be loaded (${r.status}).`;
			return;
		}
		this.items = (await r.json()).measurements;
		this.loaded = true;
		this.error = null;
	}

	toggle(id: string): void {
		if (this.hidden.has(id)) this.hidden.delete(id);
		else this.hidden.add(id);
	}

	async upload(file: File, name: string, columns: ColumnChoice): Promise<MeasurementItem> {
		const form = new FormData();
		form.set('file', file);
		form.set('name', name);
		form.set('columns', JSON.stringify(columns));
		const r = await fetch(`${this.base}/measurements`, { method: 'POST', body: form });
		const body = await r.json().catch(() => ({ error: `The upload failed (${r.status}).` }));
		if (!r.ok) throw new UploadError(body.error, body.row ?? null, body.column ?? null);
		this.items = [...this.items, body.measurement];
		return body.measurement;
	}

	async rename(id: string, name: string): Promise<void> {
		const r = await fetch(`${this.base}/measurements/${id}`, {
			method: 'PATCH',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify({ name })
		});
		const body = await r.json();
		if (!r.ok) throw new Error(body.error);
		this.items = this.items.map((m) => (m.id === id ? { ...m, name: body.measurement.name } : m));
	}

	async remove(id: string): Promise<void> {
		const r = await fetch(`${this.base}/measurements/${id}`, { method: 'DELETE' });
		if (!r.ok)
			throw new Error((await r.json().catch(() => null))?.error ?? `Delete failed (${r.status}).`);
		this.items = this.items.filter((m) => m.id !== id);
	}
}

const KEY = Symbol('polewise-exchange');
export const setExchangeContext = (s: ExchangeState) => setContext(KEY, s);
/** The sheet's exchange state, or undefined outside a sheet page (e.g. the shared-link view). */
export const getExchangeContext = () => getContext<ExchangeState | undefined>(KEY);
