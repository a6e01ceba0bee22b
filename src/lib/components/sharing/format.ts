// Dates the way the sheet tables show them. Fixed locale and UTC so the server's HTML and the
// browser's hydration print the same text; the <time> element carries the exact instant.
const short = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });

export function formatWhen(value: Date | string | null | undefined): string {
	if (!value) return '—';
	return `${short.format(new Date(value))} UTC`;
}

export function isoWhen(value: Date | string | null | undefined): string {
	return value ? new Date(value).toISOString() : '';
}
