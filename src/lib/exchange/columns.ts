// Which column holds what, and in which unit. Guessed from the header (names and units such as
// "Frequency (kHz)", "Gain [dB]", "Phase/deg") or, without one, from position and values; the
// person confirms or corrects the guess in the preview before anything is stored.
import { z } from 'zod';
import { cellNumber, type CsvTable } from './csv-table';
import { FREQUENCY_UNITS, type FrequencyUnit } from './frequency-units';

export { FREQUENCY_UNITS, type FrequencyUnit };
export type MagnitudeKind = 'dB' | 'linear';
export type PhaseUnit = 'deg' | 'rad';

export const columnChoiceSchema = z.object({
	frequency: z.number().int().min(0).max(63),
	frequencyUnit: z.enum(['Hz', 'kHz', 'MHz', 'GHz']),
	magnitude: z.number().int().min(0).max(63),
	magnitudeKind: z.enum(['dB', 'linear']),
	phase: z.number().int().min(0).max(63).nullable(),
	phaseUnit: z.enum(['deg', 'rad'])
});
export type ColumnChoice = z.infer<typeof columnChoiceSchema>;

export interface ColumnGuess extends ColumnChoice {
	/** Why each part was chosen, for the preview ("unit kHz from the header"). */
	notes: string[];
}

const FREQ_NAME = /freq|^f\b|^f\s*[([/]|hz\b/i;
const MAG_NAME = /mag|gain|ampl|\|h\||^h\b|db\b|ratio|v\/v|s21|transfer|level/i;
const PHASE_NAME = /phase|^ph\b|deg|°|angle|arg\b|^∠/i;

/** Unit of a frequency header: "Frequency (kHz)", "f [MHz]", "Freq/GHz", "Hz". */
export function frequencyUnitOf(name: string): FrequencyUnit | null {
	const m = /(?:^|[\s([/_-])(ghz|mhz|khz|hz)(?:$|[\s)\]/_-])/i.exec(name);
	if (!m) return null;
	const u = m[1].toLowerCase();
	return u === 'ghz' ? 'GHz' : u === 'mhz' ? 'MHz' : u === 'khz' ? 'kHz' : 'Hz';
}

export function magnitudeKindOf(name: string): MagnitudeKind | null {
	if (/\bdb\b|\(db|\[db|\/db|_db/i.test(name)) return 'dB';
	if (/lin|ratio|v\/v|\|h\||abs/i.test(name)) return 'linear';
	return null;
}

export function phaseUnitOf(name: string): PhaseUnit | null {
	if (/rad/i.test(name)) return 'rad';
	if (/deg|°/i.test(name)) return 'deg';
	return null;
}

export function guessColumns(table: CsvTable): ColumnGuess {
	const notes: string[] = [];
	const header = table.header;
	const width = Math.max(table.columns, header?.length ?? 0);
	const find = (re: RegExp, taken: number[]) =>
		(header ?? []).findIndex((h, i) => !taken.includes(i) && re.test(h));
	let frequency = header ? find(FREQ_NAME, []) : -1;
	if (frequency < 0) frequency = 0;
	let phase: number | null = header ? find(PHASE_NAME, [frequency]) : -1;
	let magnitude = header ? find(MAG_NAME, [frequency, phase ?? -1]) : -1;
	if (magnitude < 0)
		magnitude = [...Array(width).keys()].find((i) => i !== frequency && i !== phase) ?? 1;
	if (phase < 0) {
		// Without a name, a third column is taken as phase (the usual analyzer export order).
		const next = [...Array(width).keys()].find((i) => i !== frequency && i !== magnitude);
		phase = !header && next !== undefined ? next : null;
	}

	let frequencyUnit: FrequencyUnit = 'Hz';
	const fu = header?.[frequency] ? frequencyUnitOf(header[frequency]) : null;
	if (fu) {
		frequencyUnit = fu;
		notes.push(`frequency in ${fu} (from the header)`);
	} else notes.push('frequency taken as Hz (no unit in the header)');

	let magnitudeKind: MagnitudeKind;
	const mk = header?.[magnitude] ? magnitudeKindOf(header[magnitude]) : null;
	if (mk) {
		magnitudeKind = mk;
		notes.push(`magnitude in ${mk === 'dB' ? 'dB' : 'linear ratio'} (from the header)`);
	} else {
		const values = table.rows
			.map((r) => cellNumber(r.cells[magnitude] ?? '', table.decimalComma))
			.filter((v): v is number => v !== null);
		// A linear magnitude is never negative; a passive divider's ratio stays near or below 1.
		magnitudeKind = values.some((v) => v < 0) || Math.max(...values, 0) > 2 ? 'dB' : 'linear';
		notes.push(
			`magnitude read as ${magnitudeKind === 'dB' ? 'dB (values go negative or above 2)' : 'a linear ratio (all values between 0 and 2)'}: check this`
		);
	}
	const phaseUnit: PhaseUnit =
		(phase !== null && header?.[phase] ? phaseUnitOf(header[phase]) : null) ?? 'deg';
	if (phase !== null) notes.push(`phase in ${phaseUnit === 'deg' ? 'degrees' : 'radians'}`);
	else notes.push('no phase column');
	return { frequency, frequencyUnit, magnitude, magnitudeKind, phase, phaseUnit, notes };
}
