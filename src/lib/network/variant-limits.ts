// The variant constants the editor needs at once, apart from the zod schema (variant-schema.ts)
// so the sheet page's first load does not carry zod (docs/performance.md, page weight).

/** Joins the option names of a combination into the variant's name ("100:1 · 2 m cable"). */
export const VARIANT_JOIN = ' · ';

export const VARIANT_LIMITS = { groups: 4, options: 12, combinations: 36, nameLength: 40 };
