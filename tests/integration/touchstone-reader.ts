// A small Touchstone reader for the tests only (Polewise writes Touchstone but does not read it),
// written from the Touchstone File Format Specification Version 2.0 (IBIS Open Forum, ratified
// April 24, 2009) so our files are read back by the rules rather than by our own writer:
// "!" starts a comment anywhere on a line; keywords are in [brackets] at the start of a line;
// the option line is "# <unit> <parameter> <format> R <n>" (defaults GHz S MA R 50); a 2.0 file
// starts with [Version] 2.0 and needs [Number of Ports], [Two-Port Data Order] for 2-ports,
// [Number of Frequencies], [Network Data] and [End]; 1.x files normalize Z and Y to R, 2.0
// files do not.
export interface Complex {
	re: number;
	im: number;
}
export interface TouchstoneFile {
	version: '1.x' | '2.0';
	parameter: string;
	unit: string;
	reference: number[];
	f: number[];
	/** Per frequency [[N11, N12], [N21, N22]], un-normalized (ohms for Z, siemens for Y). */
	n: [[Complex, Complex], [Complex, Complex]][];
}

const UNITS: Record<string, number> = { hz: 1, khz: 1e3, mhz: 1e6, ghz: 1e9 };

export function readTouchstone(text: string): TouchstoneFile {
	let version: '1.x' | '2.0' = '1.x';
	let unit = 'ghz';
	let parameter = 's';
	let format = 'ma';
	let r = 50;
	let reference: number[] | null = null;
	let order: '21_12' | '12_21' | null = null;
	let expected: number | null = null;
	let ports: number | null = null;
	let inData = false;
	let ended = false;
	let option = false;
	const numbers: number[] = [];
	for (const raw of text.split(/\r\n|\r|\n/)) {
		const line = raw.split('!')[0].trim();
		if (!line) continue;
		if (ended) throw new Error(`content after [End]: "${line}"`);
		const keyword = /^\[([^\]]+)\]\s*(.*)$/.exec(line);
		if (keyword) {
			const [name, arg] = [keyword[1].toLowerCase(), keyword[2].trim()];
			if (name === 'version') {
				if (option) throw new Error('[Version] must come before the option line');
				if (arg !== '2.0') throw new Error(`unknown version ${arg}`);
				version = '2.0';
			} else if (name === 'number of ports') ports = Number(arg);
			else if (name === 'two-port data order') {
				if (arg !== '21_12' && arg !== '12_21') throw new Error(`bad data order ${arg}`);
				order = arg;
			} else if (name === 'number of frequencies') expected = Number(arg);
			else if (name === 'reference') reference = arg.split(/\s+/).map(Number);
			else if (name === 'network data') inData = true;
			else if (name === 'end') ended = true;
			else throw new Error(`keyword [${keyword[1]}] is not read here`);
			continue;
		}
		if (line.startsWith('#')) {
			if (option) continue; // later option lines are ignored
			option = true;
			const words = line.slice(1).trim().toLowerCase().split(/\s+/).filter(Boolean);
			for (let i = 0; i < words.length; i++) {
				const w = words[i];
				if (w in UNITS) unit = w;
				else if (['s', 'y', 'z', 'h', 'g'].includes(w)) parameter = w;
				else if (['ma', 'db', 'ri'].includes(w)) format = w;
				else if (w === 'r') r = Number(words[++i]);
				else throw new Error(`option line: unknown "${w}"`);
			}
			continue;
		}
		if (version === '2.0' && !inData) throw new Error(`data before [Network Data]: "${line}"`);
		numbers.push(...line.split(/\s+/).map(Number));
	}
	if (version === '2.0') {
		if (ports !== 2) throw new Error('[Number of Ports] 2 is required');
		if (!order) throw new Error('[Two-Port Data Order] is required for 2-ports');
		if (!ended) throw new Error('[End] is missing');
	}
	if (numbers.length % 9 !== 0) throw new Error('2-port data needs 9 numbers per frequency');
	const pair = (a: number, b: number): Complex => {
		if (format === 'ri') return { re: a, im: b };
		const mag = format === 'ma' ? a : 10 ** (a / 20);
		const rad = (b * Math.PI) / 180;
		return { re: mag * Math.cos(rad), im: mag * Math.sin(rad) };
	};
	// 1.x: Z/R and Y·R in the file; 2.0: as they are.
	const k = version === '2.0' ? 1 : parameter === 'z' ? r : parameter === 'y' ? 1 / r : 1;
	const f: number[] = [];
	const n: TouchstoneFile['n'] = [];
	for (let i = 0; i < numbers.length; i += 9) {
		f.push(numbers[i] * UNITS[unit]);
		const p = [0, 1, 2, 3].map((j) => {
			const c = pair(numbers[i + 1 + 2 * j], numbers[i + 2 + 2 * j]);
			return { re: c.re * k, im: c.im * k };
		});
		// 1.x and 21_12: N11 N21 N12 N22; 12_21: N11 N12 N21 N22.
		const [n11, n21, n12, n22] = order === '12_21' ? [p[0], p[2], p[1], p[3]] : p;
		n.push([
			[n11, n12],
			[n21, n22]
		]);
	}
	if (expected !== null && expected !== f.length)
		throw new Error(`[Number of Frequencies] says ${expected}, the data has ${f.length}`);
	if (f.some((x, i) => i > 0 && x <= f[i - 1])) throw new Error('frequencies must increase');
	return {
		version,
		parameter: parameter.toUpperCase(),
		unit,
		reference: reference ?? [r, r],
		f,
		n
	};
}
