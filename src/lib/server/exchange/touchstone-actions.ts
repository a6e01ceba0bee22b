// Touchstone export of a stored revision: the two-port between two chosen node pairs, S (or Z,
// Y) over a frequency list. It solves the full network at each frequency in this process, so
// the size of the job is bounded (elements × points) to keep one request short.
import { z } from 'zod';
import type { Actor } from '../access';
import { ApiProblem } from '../api/respond';
import {
	defaultPorts,
	fileStem,
	frequencyList,
	TOUCHSTONE_VERSIONS,
	TwoPortError,
	writeTouchstone,
	yFromS,
	zFromS
} from '../../exchange';
import { revisionFromQuery } from './stored-results';
import { runSolverTask } from '../jobs/analysis-pool';
import type { TwoPortOutcome } from '../workers/analyze.worker';

export const TOUCHSTONE_LIMITS = { points: 1001, elements: 400, listLength: 1001 };

const node = z.string().trim().min(1, 'a node name is required').max(64);
const port = z.object({ plus: node, minus: node.default('gnd') });
const positive = (what: string) =>
	z.coerce
		.number({ error: `${what} must be a number` })
		.positive(`${what} must be greater than 0`)
		.finite();

export const touchstoneQuery = z
	.object({
		parameter: z.enum(['S', 'Z', 'Y'], { error: 'parameter must be S, Z or Y' }).default('S'),
		format: z.enum(['RI', 'MA', 'DB'], { error: 'format must be RI, MA or DB' }).default('RI'),
		version: z.enum(TOUCHSTONE_VERSIONS, { error: 'version must be 1.1 or 2.0' }).default('1.1'),
		unit: z
			.enum(['Hz', 'kHz', 'MHz', 'GHz'], { error: 'unit must be Hz, kHz, MHz or GHz' })
			.default('Hz'),
		z0: positive('z0').default(50),
		port1: port.optional(),
		port2: port.optional(),
		fMin: positive('fMin').optional(),
		fMax: positive('fMax').optional(),
		points: z.coerce
			.number()
			.int('points must be a whole number')
			.min(1, 'points must be at least 1')
			.max(TOUCHSTONE_LIMITS.points, `points is at most ${TOUCHSTONE_LIMITS.points}`)
			.default(101),
		spacing: z.enum(['log', 'linear'], { error: 'spacing must be log or linear' }).default('log'),
		frequencies: z
			.array(positive('each frequency'))
			.min(1)
			.max(TOUCHSTONE_LIMITS.listLength, `at most ${TOUCHSTONE_LIMITS.listLength} frequencies`)
			.optional()
	})
	.refine((q) => q.fMin === undefined || q.fMax === undefined || q.fMax >= q.fMin, {
		message: 'fMax must not be below fMin',
		path: ['fMax']
	});
export type TouchstoneQuery = z.infer<typeof touchstoneQuery>;

/** `port1=a,gnd` style query values → the object form the schema reads. */
export function queryToInput(url: URL): Record<string, unknown> {
	const out: Record<string, unknown> = Object.fromEntries(url.searchParams);
	for (const key of ['port1', 'port2']) {
		const v = url.searchParams.get(key);
		if (v !== null) {
			const [plus, minus] = v.split(',').map((s) => s.trim());
			out[key] = { plus, minus: minus || 'gnd' };
		}
	}
	const list = url.searchParams.get('frequencies');
	if (list !== null) out.frequencies = list.split(/[\s,;]+/).filter(Boolean);
	return out;
}

export function readTouchstoneQuery(input: unknown): TouchstoneQuery {
	const parsed = touchstoneQuery.safeParse(input);
	if (!parsed.success) {
		const i = parsed.error.issues[0];
		throw new ApiProblem(400, `${i.path.join('.') || 'query'}: ${i.message}`);
	}
	return parsed.data;
}

export async function touchstoneAs(actor: Actor, sheetId: string, url: URL, q: TouchstoneQuery) {
	const { sheet, revision } = await revisionFromQuery(actor, sheetId, url, 'analyze');
	const doc = revision.document as {
		elements?: unknown[];
		input?: string;
		output?: { node: unknown; reference?: unknown };
	};
	if ((doc.elements?.length ?? 0) > TOUCHSTONE_LIMITS.elements) {
		throw new ApiProblem(
			413,
			`Touchstone export is limited to networks of ${TOUCHSTONE_LIMITS.elements} elements; this one has ${doc.elements!.length}.`
		);
	}
	let ports;
	try {
		ports =
			q.port1 && q.port2
				? { port1: q.port1, port2: q.port2 }
				: {
						...defaultPorts(revision.document),
						...(q.port1 ? { port1: q.port1 } : {}),
						...(q.port2 ? { port2: q.port2 } : {})
					};
	} catch {
		throw new ApiProblem(
			422,
			'The stored network is not a valid document; open it in the editor to fix it.'
		);
	}
	const frequencies = frequencyList({
		list: q.frequencies,
		fMin: q.fMin ?? 1e3,
		fMax: q.fMax ?? 1e9,
		points: q.points,
		spacing: q.spacing
	});
	// In the analysis threads, under the same admission and limits as an analysis: up to a
	// thousand complex solves must not hold the server's main thread.
	const outcome = await runSolverTask<TwoPortOutcome>('twoPortTask', {
		document: revision.document,
		...ports,
		z0: q.z0,
		frequencies
	});
	if (!outcome.ok)
		throw new ApiProblem(422, outcome.error.message, { code: 'bad_ports', ...outcome.error.details, error: outcome.error.message });
	try {
		const t = outcome.result;
		let values = t.s;
		if (q.parameter !== 'S') {
			const c = q.parameter === 'Z' ? zFromS(t) : yFromS(t);
			if (!c.ok)
				throw new ApiProblem(422, c.message, {
					code: `no_${q.parameter.toLowerCase()}_parameters`,
					frequency: c.frequency
				});
			values = c.values;
		}
		const port = (p: { plus: string; minus: string }) => `${p.plus} (+) to ${p.minus} (-)`;
		const text = writeTouchstone({
			parameter: q.parameter,
			format: q.format,
			unit: q.unit,
			z0: q.z0,
			version: q.version,
			f: t.f,
			values,
			comments: [
				`Polewise two-port export (Touchstone ${q.version} layout)`,
				`Sheet: ${sheet.name}, revision ${revision.number}`,
				`Port 1: ${port(ports.port1)}; port 2: ${port(ports.port2)}; both referenced to ${q.z0} ohm`,
				`The sheet's input source is taken out; other independent sources are at zero`,
				`Small-signal linear model: says nothing about voltage ratings, insulation or safety (see IEC 61010)`
			]
		});
		return {
			text,
			fileName: `${fileStem(sheet.name)}-r${revision.number}.s2p`,
			points: t.f.length
		};
	} catch (e) {
		if (e instanceof TwoPortError)
			throw new ApiProblem(422, e.message, { code: 'bad_ports', ...e.details, error: e.message });
		throw e;
	}
}
