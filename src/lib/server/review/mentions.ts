// Mentions are written `@handle`: the part of a person's e-mail address before the @ when that is
// unique among the people who can open the sheet, else the whole address (`@ada@lab.test`). The
// composer's autocomplete inserts exactly these, and API clients can type them by hand.
export interface Mentionable {
	id: string;
	name: string;
	email: string;
}

export type MentionResolver = (handle: string) => { id: string; name: string } | null;

/** `@` then a handle (optionally a whole address); a trailing full stop ends the sentence, not the handle. */
export const MENTION_AT = /^@([A-Za-z0-9_+-](?:[A-Za-z0-9._+-]*[A-Za-z0-9_+-])?(?:@[A-Za-z0-9-]+(?:\.[A-Za-z0-9-]+)+)?)/;

const local = (email: string) => email.slice(0, email.indexOf('@')).toLowerCase();

/** The handle the composer inserts for each person. */
export function handles(people: Mentionable[]): Map<string, string> {
	const count = new Map<string, number>();
	for (const p of people) count.set(local(p.email), (count.get(local(p.email)) ?? 0) + 1);
	return new Map(people.map((p) => [p.id, count.get(local(p.email)) === 1 ? local(p.email) : p.email.toLowerCase()]));
}

export function mentionResolver(people: Mentionable[]): MentionResolver {
	const byHandle = new Map<string, Mentionable>();
	const short = handles(people);
	for (const p of people) {
		byHandle.set(p.email.toLowerCase(), p);
		byHandle.set(short.get(p.id)!, p);
	}
	return (handle) => {
		const p = byHandle.get(handle.toLowerCase());
		return p ? { id: p.id, name: p.name } : null;
	};
}
