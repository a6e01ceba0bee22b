// Shared class lists for the exchange controls (Tailwind scans .ts files too).
export const FIELD = 'rounded-md border border-rule bg-panel px-2 py-1 text-sm text-ink';
export const PANEL = 'grid gap-3 rounded-lg border border-rule bg-panel p-4';

/** Overlay tones as whole class names (Tailwind cannot see classes built from pieces). */
export const TONE_FILL = {
	caution: 'fill-caution stroke-caution',
	fault: 'fill-fault stroke-fault',
	pass: 'fill-pass stroke-pass',
	ink: 'fill-ink stroke-ink'
} as const;
export const TONE_STROKE = {
	caution: 'stroke-caution',
	fault: 'stroke-fault',
	pass: 'stroke-pass',
	ink: 'stroke-ink'
} as const;
