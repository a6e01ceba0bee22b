// Per-browser drawing preferences. The symbol family is a matter of habit (which standard a
// designer learned), so it is remembered locally rather than stored with the sheet.
export type SymbolFamily = 'iec' | 'ieee';

const KEY = 'pw-symbol-family';

class Preferences {
	family = $state<SymbolFamily>('iec');

	constructor() {
		if (typeof localStorage !== 'undefined') {
			const saved = localStorage.getItem(KEY);
			if (saved === 'iec' || saved === 'ieee') this.family = saved;
		}
	}

	setFamily(f: SymbolFamily): void {
		this.family = f;
		if (typeof localStorage !== 'undefined') localStorage.setItem(KEY, f);
	}
}

export const preferences = new Preferences();
