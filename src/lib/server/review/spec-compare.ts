// The sheet's spec limits judged on two revisions, line by line: the limit, the value and the
// verdict before and after. The limits live with the sheet (not the revision), so both sides are
// judged against the same lines; the design aids' `specOfRevision` does the judging.
import { checkSpec, type SpecCheck, type SpecFigures } from '../../design/spec-limits';
import { ApiProblem } from '../api/respond';
import { getDesignSettings } from '../db/design-jobs';
import { specOfRevision } from '../jobs/design-service';
import { reviewOverview } from './review-actions';
import type { Actor } from '../access';
import type { VariantSpecOutcome } from '../../design/cross-spec';

export interface SpecSide {
	value: number | null;
	shown: string;
	pass: boolean;
}

export interface SpecLine {
	key: string;
	label: string;
	limit: string;
	before: SpecSide | null;
	after: SpecSide | null;
	/** How the verdict moved: 'kept' (same), 'broke' (pass → fail), 'fixed' (fail → pass). */
	turn: 'kept' | 'broke' | 'fixed';
}

export interface SpecComparison {
	/** null: `to` judged alone (nothing before it). */
	from: number | null;
	to: number;
	lines: SpecLine[];
	/** null when the sheet has no limits (nothing to pass or fail). */
	passBefore: boolean | null;
	passAfter: boolean | null;
	/** Why a side could not be judged (its network does not analyze), else null. */
	errorBefore: string | null;
	errorAfter: string | null;
	/** A sheet with variants: every variant and the specs across them, on each side (else null). */
	variantsBefore: VariantSpecOutcome | null;
	variantsAfter: VariantSpecOutcome | null;
}

const side = (c: SpecCheck | undefined): SpecSide | null =>
	c ? { value: c.value, shown: c.shown, pass: c.pass } : null;

/** Pair two pass/fail tables by line key, in the order of the newer one. */
export function pairSpecChecks(before: SpecCheck[], after: SpecCheck[]): SpecLine[] {
	const old = new Map(before.map((c) => [c.key, c]));
	const keys = [
		...after.map((c) => c.key),
		...before.filter((c) => !after.some((a) => a.key === c.key)).map((c) => c.key)
	];
	const now = new Map(after.map((c) => [c.key, c]));
	return keys.map((key) => {
		const [b, a] = [old.get(key), now.get(key)];
		const head = (a ?? b)!;
		const turn = b && a && b.pass !== a.pass ? (a.pass ? 'fixed' : 'broke') : 'kept';
		return { key, label: head.label, limit: head.limit, before: side(b), after: side(a), turn };
	});
}

type Judged = { checks: SpecCheck[]; pass: boolean; variants?: VariantSpecOutcome | null } | { error: string };

// A revision whose network the solver refuses (422) is reported, not thrown: the other side
// and the rest of the comparison still stand.
async function judge(actor: Actor, sheetId: string, n: number): Promise<Judged> {
	try {
		return (await specOfRevision(actor, sheetId, n)) as unknown as Judged;
	} catch (e) {
		if (e instanceof ApiProblem && e.status === 422) return { error: e.message };
		throw e;
	}
}

/**
 * Both revisions against the sheet's limits (access: `analyze` on the sheet, as for a
 * comparison). `from` null judges `to` alone (a first revision has nothing before it).
 */
export async function compareSpec(
	actor: Actor,
	sheetId: string,
	from: number | null,
	to: number
): Promise<SpecComparison> {
	const [a, b] = await Promise.all([
		from === null ? null : judge(actor, sheetId, from),
		judge(actor, sheetId, to)
	]);
	const failed = (j: Judged | null) => j === null || 'error' in j;
	// The lines themselves, for a side that could not be judged: the limits with no values.
	const blank = async () =>
		checkSpec((await getDesignSettings(sheetId)).spec, {} as SpecFigures).checks;
	const checksOf = async (j: Judged | null) =>
		j === null ? [] : 'error' in j ? blank() : j.checks;
	const [ca, cb] = await Promise.all([checksOf(a), checksOf(b)]);
	const lines = pairSpecChecks(ca, cb).map((l) => ({
		...l,
		before: failed(a) ? null : l.before,
		after: failed(b) ? null : l.after,
		turn: failed(a) || failed(b) ? ('kept' as const) : l.turn
	}));
	const verdict = (j: Judged | null) => (lines.length && j && !('error' in j) ? j.pass : null);
	const why = (j: Judged | null) => (j && 'error' in j ? j.error : null);
	return {
		from,
		to,
		lines,
		passBefore: verdict(a),
		passAfter: verdict(b),
		errorBefore: why(a),
		errorAfter: why(b),
		variantsBefore: a && !('error' in a) ? (a.variants ?? null) : null,
		variantsAfter: b && !('error' in b) ? (b.variants ?? null) : null
	};
}

/**
 * For the review answer: the revision the caller is asked to review, against the revision
 * signed off before it (else the one just before it). null when nobody asked the caller.
 */
export async function answerSpec(actor: Actor, sheetId: string): Promise<SpecComparison | null> {
	const o = await reviewOverview(actor, sheetId);
	const asked = o.requests.find((r) => r.id === o.myRequestId);
	if (!asked) return null;
	const n = asked.revisionNumber;
	const signedOff = o.requests
		.filter((r) => !r.withdrawnAt && r.revisionNumber < n && r.reviewers.length)
		.filter((r) => r.reviewers.every((x) => x.decision === 'approve'))
		.map((r) => r.revisionNumber);
	const from = signedOff.length ? Math.max(...signedOff) : n > 1 ? n - 1 : null;
	return compareSpec(actor, sheetId, from, n);
}
