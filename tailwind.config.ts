import type { Config } from 'tailwindcss';

// Colours are CSS variables (see src/app.css) so one class serves the light and dark themes.
const tone = (name: string) => `rgb(var(--pw-${name}) / <alpha-value>)`;

export default {
	content: ['./src/**/*.{html,js,svelte,ts}'],
	darkMode: ['class', '[data-theme="dark"]'],
	theme: {
		extend: {
			colors: {
				paper: tone('paper'),
				panel: tone('panel'),
				ink: tone('ink'),
				muted: tone('muted'),
				rule: tone('rule'),
				signal: tone('signal'),
				trace: tone('trace'),
				pass: tone('pass'),
				fault: tone('fault'),
				caution: tone('caution')
			},
			fontFamily: {
				sans: ['"Inter Variable"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
				mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'monospace']
			}
		}
	},
	plugins: []
} satisfies Config;
