/** Engineering prefixes for display, exponent multiple of 3 → symbol. `u` is shown as µ. */
const SYMBOL: Record<number, string> = {
	[-24]: 'y',
	[-21]: 'z',
	[-18]: 'a',
	[-15]: 'f',
	[-12]: 'p',
	[-9]: 'n',
	[-6]: 'µ',
	[-3]: 'm',
	0: '',
	3: 'k',
	6: 'M',
	9: 'G',
	12: 'T'
};

/**
 * `formatEngineering(9.1e6, 'Ω')` → `"9.1 MΩ"`; `digits` significant figures, trailing zeros
 * dropped so a trimmed value reads as typed. Infinity reads "∞", NaN reads "—".
 */
export function formatEngineering(value: number, unit = '', digits = 4): string {
	const sep = unit ? ' ' : '';
	if (Number.isNaN(value)) return '—';
	if (!Number.isFinite(value)) return (value < 0 ? '−∞' : '∞') + (unit ? sep + unit : '');
	if (value === 0) return `0${sep}${unit}`;
	const sign = value < 0 ? '-' : '';
	let a = Math.abs(value);
	// Round first: 999.96 at 4 digits must become "1 k", not "1000".
	const rounded = Number(a.toPrecision(digits));
	a = rounded;
	let exp3 = Math.floor(Math.log10(a) / 3) * 3;
	exp3 = Math.max(-24, Math.min(12, exp3));
	const mant = Number((a / 10 ** exp3).toPrecision(digits));
	if (mant >= 1000 && exp3 < 12) {
		exp3 += 3;
	}
	const m2 = Number((a / 10 ** exp3).toPrecision(digits));
	const text = String(m2).includes('e') ? m2.toPrecision(digits) : String(m2);
	return `${sign}${text}${sep}${SYMBOL[exp3]}${unit}`;
}
