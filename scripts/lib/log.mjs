// Console helpers for the bootstrap: short, prefixed lines so a newcomer can follow each step.
export function step(message) {
	console.log(`\x1b[36m▸\x1b[0m ${message}`);
}

export function info(message) {
	console.log(`  ${message}`);
}

/** A setup problem the user can fix: print what happened and what to do, then exit. */
export class SetupError extends Error {
	constructor(message, hint) {
		super(message);
		this.hint = hint;
	}
}

export function reportAndExit(error) {
	if (error instanceof SetupError) {
		console.error(`\x1b[31m✖ ${error.message}\x1b[0m`);
		if (error.hint) console.error(`  ${error.hint}`);
		process.exit(1);
	}
	console.error(error);
	process.exit(1);
}
