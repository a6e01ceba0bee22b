// One way to write a JSON value, so a file written, read back and written again is the same
// bytes: keys in a fixed order (the known ones first, the rest alphabetical), tab-free two-space
// indentation, "\n" line ends and a final newline. PostgreSQL's jsonb reorders keys on storage,
// which is why the order cannot be left to insertion.

export type KeyOrder = Record<string, string[]>;

function sortKeys(obj: Record<string, unknown>, preferred: string[] = []): string[] {
	const keys = Object.keys(obj).filter((k) => obj[k] !== undefined);
	const known = preferred.filter((k) => keys.includes(k));
	const rest = keys.filter((k) => !preferred.includes(k)).sort();
	return [...known, ...rest];
}

/**
 * `orders` maps a dotted path pattern to its preferred keys; `*` stands for any array index,
 * e.g. { '': ['format', 'version'], 'document.elements.*': ['id', 'type'] }.
 */
export function canonicalize(value: unknown, orders: KeyOrder = {}, path = ''): unknown {
	if (Array.isArray(value))
		return value.map((v) => canonicalize(v, orders, path ? `${path}.*` : '*'));
	if (value && typeof value === 'object') {
		const obj = value as Record<string, unknown>;
		const out: Record<string, unknown> = {};
		for (const k of sortKeys(obj, orders[path]))
			out[k] = canonicalize(obj[k], orders, path ? `${path}.${k}` : k);
		return out;
	}
	if (typeof value === 'number' && !Number.isFinite(value)) return null;
	return value;
}

export function canonicalJson(value: unknown, orders: KeyOrder = {}): string {
	return `${JSON.stringify(canonicalize(value, orders), null, 2)}\n`;
}
