import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';
import { readFileSync } from 'node:fs';

const { version } = JSON.parse(readFileSync(new URL('./package.json', import.meta.url), 'utf8'));

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		adapter: adapter({ out: 'build' }),
		version: { name: version },
		// The pages' Content-Security-Policy (docs/security.md). SvelteKit adds a fresh nonce for
		// its own hydration script to every page it renders ('auto': hashes for prerendered
		// pages), so no script runs unless it is ours: no 'unsafe-inline', no 'unsafe-eval' for
		// scripts. Styles do need 'unsafe-inline': Svelte's style: directives and the canvas
		// library (@xyflow/svelte) position every part and wire with inline style attributes,
		// which no nonce or hash can cover (style attributes are not elements). Inline style
		// cannot run script, so it only widens what injected markup could restyle — and
		// comments' markdown is sanitised to a short tag list without style attributes.
		// Everything else is this origin only; nobody may frame a page (the sign-off and share
		// buttons must not be clickjacked). The other security headers are set for every answer,
		// pages and API alike, in $lib/server/security-headers.ts.
		csp: {
			mode: 'auto',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self', 'data:'],
				'connect-src': ['self'],
				'worker-src': ['self', 'blob:'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'form-action': ['self'],
				'frame-ancestors': ['none'],
				'frame-src': ['none'],
				'manifest-src': ['self']
			}
		}
	}
};

export default config;
