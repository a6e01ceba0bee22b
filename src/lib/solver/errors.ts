/**
 * The one error type the solver throws for bad input. `code` is stable (the route maps it to
 * 400/422 and the editor highlights `element` / `node`); the message is for people.
 */
export type SolverErrorCode =
	| 'bad_document'
	| 'empty_network'
	| 'bad_value'
	| 'zero_value'
	| 'non_finite'
	| 'underflow'
	| 'duplicate_id'
	| 'unknown_type'
	| 'unknown_control'
	| 'bad_input'
	| 'unknown_output_node'
	| 'bad_nodes'
	| 'source_loop'
	| 'current_cutset'
	| 'singular'
	| 'bad_variants';

export class SolverError extends Error {
	readonly code: SolverErrorCode;
	readonly element?: string;
	readonly node?: string;

	constructor(
		code: SolverErrorCode,
		message: string,
		where: { element?: string; node?: string } = {}
	) {
		super(message);
		this.name = 'SolverError';
		this.code = code;
		if (where.element !== undefined) this.element = where.element;
		if (where.node !== undefined) this.node = where.node;
	}

	/** Plain form for JSON bodies and the command's stderr line. */
	toJSON(): { error: string; code: string; element?: string; node?: string } {
		return {
			error: this.message,
			code: this.code,
			...(this.element !== undefined ? { element: this.element } : {}),
			...(this.node !== undefined ? { node: this.node } : {})
		};
	}
}
