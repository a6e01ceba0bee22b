import js from '@eslint/js';
import svelte from 'eslint-plugin-svelte';
import globals from 'globals';
import ts from 'typescript-eslint';
import svelteConfig from './svelte.config.js';

export default ts.config(
	js.configs.recommended,
	...ts.configs.recommended,
	...svelte.configs.recommended,
	{
		languageOptions: { globals: { ...globals.browser, ...globals.node } }
	},
	{
		files: ['**/*.svelte', '**/*.svelte.ts', '**/*.svelte.js'],
		languageOptions: {
			parserOptions: { projectService: true, extraFileExtensions: ['.svelte'], parser: ts.parser, svelteConfig }
		}
	},
	{
		rules: {
			'@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
			// Polewise is served at the site root (no kit.paths.base), so plain hrefs and goto()
			// paths are already correct; wrapping each in resolve() would add noise, not safety.
			'svelte/no-navigation-without-resolve': 'off'
		}
	},
	{
		// The sheet page's first load: the solver's and the exchange code's barrels carry the
		// numerics, zod and papaparse, which the browser does not run until asked. Components and
		// editor state import their light entries ($lib/solver/notation, single exchange files) or
		// load the barrel with import() when used (docs/performance.md, page weight).
		files: ['src/lib/components/**', 'src/lib/editor/**', 'src/routes/**/*.svelte'],
		rules: {
			'@typescript-eslint/no-restricted-imports': [
				'error',
				{
					paths: [
						{ name: '$lib/solver', allowTypeImports: true, message: 'Import $lib/solver/notation, or the solver with import() where it runs in the browser.' },
						{ name: '$lib/exchange', allowTypeImports: true, message: 'Import the one file, or the barrel with import() when the user asks for it.' },
						{ name: 'zod', allowTypeImports: true, message: 'Schemas belong beside routes and in $lib/network; the browser’s first load carries no zod.' },
						// (design-schema is left to the design aids, which load after the first results)
						...['schema', 'variant-schema'].map((f) => ({ name: `$lib/network/${f}`, allowTypeImports: true, message: 'Types only here: the schema carries zod. Constants live in a zod-free file (e.g. variant-limits.ts).' }))
					]
				}
			]
		}
	},
	{
		ignores: ['build/', '.test-builds/', 'docs/images/', '.svelte-kit/', 'node_modules/', '.data/', 'test-results/', 'playwright-report/', 'bench-results/']
	}
);
