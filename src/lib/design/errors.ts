/**
 * The design aids' one error type, shaped like the solver's so routes answer both the same way:
 * a stable `code`, a message for people, and the element at fault where there is one.
 */
export type DesignErrorCode =
	| 'unknown_element'
	| 'not_adjustable'
	| 'fixed_part'
	| 'bad_value'
	| 'bad_range'
	| 'no_solution'
	| 'no_metric'
	| 'cancelled'
	| 'too_many';

export class DesignError extends Error {
	readonly code: DesignErrorCode;
	readonly element?: string;

	constructor(code: DesignErrorCode, message: string, where: { element?: string } = {}) {
		super(message);
		this.name = 'DesignError';
		this.code = code;
		if (where.element !== undefined) this.element = where.element;
	}

	toJSON(): { error: string; code: string; element?: string } {
		return {
			error: this.message,
			code: this.code,
			...(this.element !== undefined ? { element: this.element } : {})
		};
	}
}
