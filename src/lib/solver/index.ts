/** Public API of the network solver. Everything else in this folder is internal. */
export { analyze } from './analyze';
export { validateNetwork } from './validate';
export { SolverError, type SolverErrorCode } from './errors';
export { parseValue } from './parse-value';
export { formatEngineering } from './format';
export { frequencyResponseAt } from './frequency-response';
export { networkDocumentSchema, type NetworkDocument } from '../network/schema';
export type {
	Analysis,
	AnalyzeOptions,
	Doublet,
	PoleEstimate,
	PoleInfo,
	ResistanceFormula,
	ResolvedNetwork,
	Singularity,
	TimeConstant,
	Warning
} from './types';
