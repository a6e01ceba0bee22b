// Response trimming for POST /api/analyze: `?omit=impedanceCurve,groupDelay,expansion` and
// `?matrixPorts=N` leave out parts of the analysis a caller does not draw (the editor's live
// panels), so less JSON is built, sent and parsed on every edit. Without them the answer is
// the whole analysis, as before. Every trimmed part keeps its key and type: arrays become empty,
// `expansion` becomes null (its documented "not available" value).
import { z } from 'zod';
import type { Analysis, AnalyzeOptions } from '../solver';
import { ApiProblem } from './api/problem';

export const OMITTABLE = ['impedanceCurve', 'groupDelay', 'expansion'] as const;
export type Omittable = (typeof OMITTABLE)[number];

export interface Trim {
	omit: Set<Omittable>;
	/** Above this many ports, the R and C matrices are sent empty (ports and kinds stay). */
	matrixPorts: number | null;
}

const omitSchema = z
	.string()
	.transform((s) =>
		s
			.split(',')
			.map((p) => p.trim())
			.filter(Boolean)
	)
	.pipe(z.array(z.enum(OMITTABLE, { error: `omit takes ${OMITTABLE.join(', ')}` })));
const portsSchema = z.coerce
	.number({ error: 'matrixPorts must be a number' })
	.int('matrixPorts must be a whole number')
	.min(0, 'matrixPorts must be at least 0');

export function readTrim(url: URL): Trim {
	const omit = omitSchema.safeParse(url.searchParams.get('omit') ?? '');
	if (!omit.success)
		throw new ApiProblem(400, omit.error.issues[0].message, { code: 'bad_options' });
	const raw = url.searchParams.get('matrixPorts');
	const ports = raw === null ? null : portsSchema.safeParse(raw);
	if (ports && !ports.success) {
		throw new ApiProblem(400, ports.error.issues[0].message, { code: 'bad_options' });
	}
	return { omit: new Set(omit.data), matrixPorts: ports ? ports.data : null };
}

/** The solver options that leave omitted parts uncomputed. */
export function skipped({ omit }: Trim): Pick<AnalyzeOptions, 'expansion' | 'impedanceCurve'> {
	return {
		...(omit.has('expansion') ? { expansion: false as const } : {}),
		...(omit.has('impedanceCurve') ? { impedanceCurve: false as const } : {})
	};
}

export function trimAnalysis(a: Analysis, { omit, matrixPorts }: Trim): Analysis {
	const out = { ...a };
	if (omit.has('impedanceCurve') && a.inputImpedance) {
		out.inputImpedance = { dc: a.inputImpedance.dc, f: [], magnitude: [], phaseDeg: [] };
	}
	if (omit.has('groupDelay') && a.frequencyResponse) {
		out.frequencyResponse = { ...a.frequencyResponse, groupDelay: [] };
	}
	if (omit.has('expansion')) out.expansion = null;
	if (matrixPorts !== null && a.portMatrices.ports.length > matrixPorts) {
		out.portMatrices = { ...a.portMatrices, R: [], C: [] };
	}
	return out;
}
