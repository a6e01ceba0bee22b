import type { Handle } from '@sveltejs/kit';

export const THEME_COOKIE = 'pw-theme';
export type Theme = 'light' | 'dark';

/** Render the chosen theme on the server so the first paint is already right (no flash). */
export const themeHandle: Handle = ({ event, resolve }) => {
	const theme: Theme = event.cookies.get(THEME_COOKIE) === 'dark' ? 'dark' : 'light';
	return resolve(event, {
		transformPageChunk: ({ html }) => html.replace('%pw.theme%', theme)
	});
};
