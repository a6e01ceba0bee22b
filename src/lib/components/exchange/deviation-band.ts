// Band edges typed like values elsewhere in Polewise ("10k", "2.5MHz", "1e6"): Hz only.
import { parseValue } from '$lib/solver/notation';
export { deviation } from '$lib/exchange/deviation';

export function parseEngineeringHz(text: string): number | null {
	const t = text.trim().replace(/\s+/g, '').replace(/hz$/i, '');
	if (!t) return null;
	try {
		const v = parseValue(t);
		return Number.isFinite(v) && v > 0 ? v : null;
	} catch {
		return null;
	}
}
