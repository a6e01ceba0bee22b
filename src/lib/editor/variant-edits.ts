// Edits of a sheet's variant block, as pure functions: each takes the block and returns a new
// one (never mutating), so the editor can hand the result to `apply` and undo covers it. Empty
// lists and maps are dropped, so a block with nothing left in it becomes null (no `variants`
// key in the document: a sheet without variants stays byte-for-byte what it was).
import type { VariantGroup, VariantOption, VariantSet } from '$lib/network/variant-schema';
import { VARIANT_LIMITS } from '$lib/network/variant-limits';

export type Variants = VariantSet | null;

function tidyOption(o: VariantOption): VariantOption {
	const out: VariantOption = { name: o.name };
	if (o.values && Object.keys(o.values).length) out.values = o.values;
	if (o.absent?.length) out.absent = o.absent;
	if (o.present?.length) out.present = o.present;
	return out;
}

function tidy(v: VariantSet): Variants {
	const groups = v.groups.map((g) => ({ ...g, options: g.options.map(tidyOption) }));
	// Without groups nothing can put a part back: the parts left out of the base return with
	// the last group (else they would vanish from the network with nothing on screen saying so).
	if (!groups.length) return null;
	const absent = v.absent?.length ? v.absent : undefined;
	return { ...(absent ? { absent } : {}), groups };
}

const groupsOf = (v: Variants) => v?.groups ?? [];

/** A name not yet among `taken`: "Range", "Range 2", … */
export function freshName(base: string, taken: string[]): string {
	if (!taken.includes(base)) return base;
	for (let i = 2; ; i++) if (!taken.includes(`${base} ${i}`)) return `${base} ${i}`;
}

/** Why a group or option name is refused, or null. */
export function variantNameProblem(name: string, taken: string[]): string | null {
	const n = name.trim();
	if (!n) return 'a name is needed';
	if (n.length > VARIANT_LIMITS.nameLength)
		return `at most ${VARIANT_LIMITS.nameLength} characters`;
	if (n.includes('·')) return '“·” joins option names; use another character';
	if (taken.includes(n)) return `“${n}” is taken`;
	return null;
}

/** A new group with two options: the drawing as drawn, and a second one to fill in. */
export function addGroup(v: Variants, name?: string): Variants {
	const groups = groupsOf(v);
	const g: VariantGroup = {
		name:
			name ??
			freshName(
				'Group',
				groups.map((x) => x.name)
			),
		options: [{ name: 'as drawn' }, { name: 'option 2' }]
	};
	return tidy({ ...(v ?? {}), groups: [...groups, g] });
}

export function removeGroup(v: Variants, g: number): Variants {
	if (!v) return v;
	return tidy({ ...v, groups: v.groups.filter((_, i) => i !== g) });
}

export function renameGroup(v: Variants, g: number, name: string): Variants {
	if (!v) return v;
	return tidy({
		...v,
		groups: v.groups.map((x, i) => (i === g ? { ...x, name: name.trim() } : x))
	});
}

function mapOption(
	v: Variants,
	g: number,
	o: number,
	f: (opt: VariantOption) => VariantOption
): Variants {
	if (!v) return v;
	return tidy({
		...v,
		groups: v.groups.map((x, i) =>
			i === g ? { ...x, options: x.options.map((opt, k) => (k === o ? f(opt) : opt)) } : x
		)
	});
}

export function addOption(v: Variants, g: number, name?: string): Variants {
	if (!v) return v;
	return tidy({
		...v,
		groups: v.groups.map((x, i) =>
			i === g
				? {
						...x,
						options: [
							...x.options,
							{
								name:
									name ??
									freshName(
										`option ${x.options.length + 1}`,
										x.options.map((o) => o.name)
									)
							}
						]
					}
				: x
		)
	});
}

/** Removing a group's last option removes the group. */
export function removeOption(v: Variants, g: number, o: number): Variants {
	if (!v) return v;
	const group = v.groups[g];
	if (!group) return v;
	if (group.options.length <= 1) return removeGroup(v, g);
	return tidy({
		...v,
		groups: v.groups.map((x, i) =>
			i === g ? { ...x, options: x.options.filter((_, k) => k !== o) } : x
		)
	});
}

export function renameOption(v: Variants, g: number, o: number, name: string): Variants {
	return mapOption(v, g, o, (opt) => ({ ...opt, name: name.trim() }));
}

/** Set (text) or clear (null) an option's value for one part. */
export function setOptionValue(
	v: Variants,
	g: number,
	o: number,
	element: string,
	value: string | null
): Variants {
	return mapOption(v, g, o, (opt) => {
		const values = { ...(opt.values ?? {}) };
		if (value === null || value.trim() === '') delete values[element];
		else values[element] = value.trim();
		return { ...opt, values };
	});
}

/** Whether a part is in the base network (the drawing minus `variants.absent`). */
export const inBase = (v: Variants, element: string) => !(v?.absent ?? []).includes(element);

/**
 * Put a part in or out of the base network. Taking it out of the base drops the options' "absent"
 * for it (nothing to take out); putting it back drops their "present" (it is there already).
 */
export function setInBase(v: Variants, element: string, present: boolean): Variants {
	const base = v ?? { groups: [] };
	const absent = (base.absent ?? []).filter((id) => id !== element);
	if (!present) absent.push(element);
	const groups = base.groups.map((g) => ({
		...g,
		options: g.options.map((o) => ({
			...o,
			absent: present ? o.absent : o.absent?.filter((id) => id !== element),
			present: present ? o.present?.filter((id) => id !== element) : o.present
		}))
	}));
	return tidy({ ...base, absent, groups });
}

/** Is the part in the network when this option is chosen (from this option alone)? */
export function inOption(v: Variants, g: number, o: number, element: string): boolean {
	const opt = v?.groups[g]?.options[o];
	if (inBase(v, element)) return !(opt?.absent ?? []).includes(element);
	return (opt?.present ?? []).includes(element);
}

/** Make a part present or absent in one option, relative to the base. */
export function setInOption(
	v: Variants,
	g: number,
	o: number,
	element: string,
	present: boolean
): Variants {
	const base = inBase(v, element);
	return mapOption(v, g, o, (opt) => {
		const absent = (opt.absent ?? []).filter((id) => id !== element);
		const put = (opt.present ?? []).filter((id) => id !== element);
		if (base && !present) absent.push(element);
		if (!base && present) put.push(element);
		return { ...opt, absent, present: put };
	});
}

/** A part renamed on the canvas: its overrides follow it. */
export function renameElement(v: Variants, from: string, to: string): Variants {
	if (!v) return v;
	const swap = (ids?: string[]) => ids?.map((id) => (id === from ? to : id));
	return tidy({
		absent: swap(v.absent),
		groups: v.groups.map((g) => ({
			...g,
			options: g.options.map((o) => ({
				...o,
				values: o.values
					? Object.fromEntries(Object.entries(o.values).map(([k, x]) => [k === from ? to : k, x]))
					: undefined,
				absent: swap(o.absent),
				present: swap(o.present)
			}))
		}))
	});
}

/** Parts deleted from the canvas: their overrides go with them. */
export function dropElements(v: Variants, ids: Set<string>): Variants {
	if (!v) return v;
	const keep = (list?: string[]) => list?.filter((id) => !ids.has(id));
	return tidy({
		absent: keep(v.absent),
		groups: v.groups.map((g) => ({
			...g,
			options: g.options.map((o) => ({
				...o,
				values: o.values
					? Object.fromEntries(Object.entries(o.values).filter(([k]) => !ids.has(k)))
					: undefined,
				absent: keep(o.absent),
				present: keep(o.present)
			}))
		}))
	});
}
