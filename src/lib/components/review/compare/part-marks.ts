// Which parts to outline on each side of a comparison, and in what words. The older drawing
// shows what went away and what a change started from; the newer one what came and what it
// became. Words carry the values, with their units, so the drawing says as much as the table.
import { valueText } from '$lib/review/value-text';
export type MarkKind = 'added' | 'removed' | 'changed';
export interface PartMark {
	kind: MarkKind;
	words: string;
}

interface Diff {
	added: { id: string }[];
	removed: { id: string }[];
	changed: { id: string; type?: string; changes: { field: string; from: string | null; to: string | null }[] }[];
}

/** Tone (Tailwind text colour), outline dash and badge sign per kind: never colour alone. */
export const MARK_STYLE: Record<
	MarkKind,
	{ tone: string; dash: string; sign: string; badge: string }
> = {
	added: { tone: 'text-pass', dash: '', sign: '+', badge: '●' },
	removed: { tone: 'text-fault', dash: '7 4', sign: '−', badge: '■' },
	changed: { tone: 'text-caution', dash: '2 3', sign: '∆', badge: '◆' }
};

const fieldWords: Record<string, string> = {
	value: '',
	type: 'kind ',
	control: 'control '
};

function changeWords(e: Diff['changed'][number], side: 'older' | 'newer'): string {
	const parts = e.changes.map((c) => {
		if (c.field === 'nodes') return 'wiring';
		const raw = side === 'older' ? c.to : c.from;
		const v = c.field === 'value' && e.type ? valueText(e.type, raw) : raw;
		return `${fieldWords[c.field] ?? ''}${side === 'older' ? '→ ' : 'was '}${v ?? '—'}`;
	});
	return `changed: ${parts.join(', ')}`;
}

export function partMarks(diff: Diff, side: 'older' | 'newer'): Map<string, PartMark> {
	const out = new Map<string, PartMark>();
	const ends = side === 'older' ? diff.removed : diff.added;
	for (const e of ends)
		out.set(e.id, {
			kind: side === 'older' ? 'removed' : 'added',
			words: side === 'older' ? 'removed' : 'added'
		});
	for (const e of diff.changed)
		out.set(e.id, { kind: 'changed', words: changeWords(e, side) });
	return out;
}
