// Shared class lists for the exchange controls (Tailwind scans .ts files too).
export const FIELD = 'rounded-md border border-rule bg-panel px-2 py-1 text-sm text-ink';
export const PANEL = 'grid gap-3 rounded-lg border border-rule bg-panel p-4';
