// Per-browser drawing preferences. The symbol family is a matter of habit (which standard a
// designer learned), so it is remembered locally rather than stored with the sheet.
export type SymbolFamily = 'iec' | 'ieee';

const KEY = 'pw-symbol-family';
const NETS_KEY = 'pw-show-net-names';

class Preferences {
	family = $state<SymbolFamily>('iec');
	/** Net names written on the canvas (always shown on hover of a wire). */
	showNetNames = $state(false);

	constructor() {
		if (typeof localStorage !== 'undefined') {
			const saved = localStorage.getItem(KEY);
			if (saved === 'iec' || saved === 'ieee') this.family = saved;
			this.showNetNames = localStorage.getItem(NETS_KEY) === '1';
		}
	}

	setShowNetNames(on: boolean): void {
		this.showNetNames = on;
		if (typeof localStorage !== 'undefined') localStorage.setItem(NETS_KEY, on ? '1' : '0');
	}

	setFamily(f: SymbolFamily): void {
		this.family = f;
		if (typeof localStorage !== 'undefined') localStorage.setItem(KEY, f);
	}
}

export const preferences = new Preferences();
