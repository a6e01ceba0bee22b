// A part's value as a reader should see it: with its unit, in engineering notation ("6.8p" on a
// capacitor reads "6.8 pF", "50" on a resistor "50 Ω"). Used wherever a stored value is shown
// outside the editor: the comparison's table and drawings, the report's schematic. A value the
// parser refuses is shown as typed (it is the reason the revision did not analyse).
import { formatEngineering, parseValue } from '../solver';

const UNIT: Record<string, string> = {
	R: 'Ω',
	C: 'F',
	L: 'H',
	V: 'V',
	I: 'A',
	VCCS: 'S',
	CCVS: 'Ω'
};
/** Gains of the dimensionless controlled sources, written as ratios, not with SI prefixes. */
const RATIO: Record<string, string> = { VCVS: 'V/V', CCCS: 'A/A' };

export function valueText(type: string, raw: string | number | null | undefined): string {
	if (raw === null || raw === undefined || raw === '') return '—';
	try {
		const v = parseValue(raw, UNIT[type]);
		if (RATIO[type]) return `${Number(v.toPrecision(6))} ${RATIO[type]}`;
		return formatEngineering(v, UNIT[type] ?? '', 6);
	} catch {
		return String(raw);
	}
}
