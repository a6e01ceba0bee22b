// Open-source software that ships to the browser with Polewise, with the notices its licence
// asks to keep. The canvas library's attribution used to sit in the corner of every drawing;
// its MIT licence asks for the copyright and permission notice in copies of the software, not
// for a mark on the canvas, so the notice lives here, on the credits page linked from every
// page's footer. tests/unit/credits.test.ts checks names, versions and licences against
// node_modules so this list cannot drift.
export interface Credit {
	name: string;
	version: string;
	licence: 'MIT' | 'ISC' | 'OFL-1.1';
	copyright: string;
	what: string;
}

export const CREDITS: Credit[] = [
	{ name: '@xyflow/svelte', version: '1.7.0', licence: 'MIT', copyright: 'Copyright (c) 2019-2025 webkid GmbH', what: 'the drawing canvas' },
	{ name: '@xyflow/system', version: '0.0.83', licence: 'MIT', copyright: 'Copyright (c) 2019-2025 webkid GmbH', what: 'the drawing canvas (its core)' },
	{ name: 'svelte', version: '5.57.3', licence: 'MIT', copyright: 'Copyright (c) 2016-2025 Svelte Contributors', what: 'the user interface' },
	{ name: 'd3-scale', version: '4.0.3', licence: 'ISC', copyright: 'Copyright 2010-2026 Mike Bostock', what: 'plot axes' },
	{ name: 'complex.js', version: '2.4.3', licence: 'MIT', copyright: 'Copyright (c) 2025 Robert Eisele', what: 'complex arithmetic in the solver' },
	{ name: 'ml-matrix', version: '6.15.1', licence: 'MIT', copyright: 'Copyright (c) 2014 Michaël Zasso', what: 'matrices in the solver' },
	{ name: 'zod', version: '4.6.7', licence: 'MIT', copyright: 'Copyright (c) 2025 Colin McDonnell', what: 'checking documents and forms' },
	{ name: 'papaparse', version: '5.7.1', licence: 'MIT', copyright: 'Copyright (c) 2015 Matthew Holt', what: 'reading measured CSV files' },
	{ name: '@fontsource-variable/inter', version: '5.3.0', licence: 'OFL-1.1', copyright: 'Copyright 2016 The Inter Project Authors (https://github.com/rsms/inter)', what: 'the Inter typeface' }
];

export const LICENCE_TEXT: Record<Credit['licence'], string> = {
	MIT: `Permission is hereby granted, free of charge, to any person obtaining a copy of this software and associated documentation files (the "Software"), to deal in the Software without restriction, including without limitation the rights to use, copy, modify, merge, publish, distribute, sublicense, and/or sell copies of the Software, and to permit persons to whom the Software is furnished to do so, subject to the following conditions:

The above copyright notice and this permission notice shall be included in all copies or substantial portions of the Software.

THE SOFTWARE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND, EXPRESS OR IMPLIED, INCLUDING BUT NOT LIMITED TO THE WARRANTIES OF MERCHANTABILITY, FITNESS FOR A PARTICULAR PURPOSE AND NONINFRINGEMENT. IN NO EVENT SHALL THE AUTHORS OR COPYRIGHT HOLDERS BE LIABLE FOR ANY CLAIM, DAMAGES OR OTHER LIABILITY, WHETHER IN AN ACTION OF CONTRACT, TORT OR OTHERWISE, ARISING FROM, OUT OF OR IN CONNECTION WITH THE SOFTWARE OR THE USE OR OTHER DEALINGS IN THE SOFTWARE.`,
	ISC: `Permission to use, copy, modify, and/or distribute this software for any purpose with or without fee is hereby granted, provided that the above copyright notice and this permission notice appear in all copies.

THE SOFTWARE IS PROVIDED "AS IS" AND THE AUTHOR DISCLAIMS ALL WARRANTIES WITH REGARD TO THIS SOFTWARE INCLUDING ALL IMPLIED WARRANTIES OF MERCHANTABILITY AND FITNESS. IN NO EVENT SHALL THE AUTHOR BE LIABLE FOR ANY SPECIAL, DIRECT, INDIRECT, OR CONSEQUENTIAL DAMAGES OR ANY DAMAGES WHATSOEVER RESULTING FROM LOSS OF USE, DATA OR PROFITS, WHETHER IN AN ACTION OF CONTRACT, NEGLIGENCE OR OTHER TORTIOUS ACTION, ARISING OUT OF OR IN CONNECTION WITH THE USE OR PERFORMANCE OF THIS SOFTWARE.`,
	'OFL-1.1': `This Font Software is licensed under the SIL Open Font License, Version 1.1 (https://openfontlicense.org). The font may be used, studied, modified and redistributed freely, bundled with software, provided it is not sold by itself.`
};
