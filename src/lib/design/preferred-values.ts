// IEC 60063 preferred-number series E3 … E192. E3–E24 are tabulated values (the standard's
// E24 departs from the rounded geometric series at 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2, so
// they cannot be computed); E48, E96 and E192 are 10^(i/n) rounded to three significant figures,
// with the standard's one exception, 9.20 instead of 9.19 in E192. Values from memory of the
// standard's tables, checked against the properties the tests list.

export const SERIES = ['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192'] as const;
export type Series = (typeof SERIES)[number];

const E24 = [
	1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6,
	6.2, 6.8, 7.5, 8.2, 9.1
];

function geometric(n: number): number[] {
	return Array.from({ length: n }, (_, i) => {
		const value = Number(Math.pow(10, i / n).toPrecision(3));
		return n === 192 && value === 9.19 ? 9.2 : value;
	});
}

const MANTISSAS: Record<Series, readonly number[]> = {
	E3: [1.0, 2.2, 4.7],
	E6: [1.0, 1.5, 2.2, 3.3, 4.7, 6.8],
	E12: E24.filter((_, i) => i % 2 === 0),
	E24,
	E48: geometric(48),
	E96: geometric(96),
	E192: geometric(192)
};

/** The series' values in one decade, [1, 10). */
export function decadeValues(series: Series): readonly number[] {
	return MANTISSAS[series];
}

export interface Snapped {
	below: number;
	above: number;
	nearest: number;
}

/**
 * The series values on both sides of `value` (any positive magnitude) and the nearest of them,
 * nearest judged by ratio (the series are geometric, so ratio is the fair distance).
 */
export function snapToSeries(value: number, series: Series): Snapped {
	if (!(value > 0) || !Number.isFinite(value)) {
		throw new RangeError(`a preferred value needs a positive finite number, not ${value}`);
	}
	const exponent = Math.floor(Math.log10(value));
	const scale = Math.pow(10, exponent);
	const mantissa = value / scale;
	const list = MANTISSAS[series];
	// A relative guard so 4.7e-12 typed by a person counts as exactly on the series.
	const eps = 1e-9;
	let below = list[0] * scale;
	let above = 10 * scale;
	for (const m of list) {
		if (m <= mantissa * (1 + eps)) below = m * scale;
		if (m >= mantissa * (1 - eps)) {
			above = m * scale;
			break;
		}
	}
	const tidy = (x: number) => Number(x.toPrecision(4));
	below = tidy(below);
	above = tidy(above);
	const nearest = value / below <= above / value ? below : above;
	return { below, above, nearest };
}
