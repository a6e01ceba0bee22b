import { spawn, spawnSync } from 'node:child_process';

/** Run a command to completion with inherited output; throws on a non-zero exit. */
export function run(command, args, options = {}) {
	const result = spawnSync(command, args, { stdio: 'inherit', ...options });
	if (result.error) throw result.error;
	if (result.status !== 0) {
		const error = new Error(`${command} ${args.join(' ')} exited with ${result.status}`);
		error.status = result.status;
		throw error;
	}
	return result;
}

/** Run a command and return its stdout (trimmed); throws with stderr on failure. */
export function capture(command, args, options = {}) {
	const result = spawnSync(command, args, { encoding: 'utf8', ...options });
	if (result.error) throw result.error;
	if (result.status !== 0) {
		throw new Error(`${command} ${args.join(' ')} failed: ${(result.stderr || result.stdout).trim()}`);
	}
	return result.stdout.trim();
}

/** Run a command and resolve with its exit code (never rejects on a non-zero exit). */
export function runAsync(command, args, options = {}) {
	return new Promise((resolve, reject) => {
		const child = spawn(command, args, { stdio: 'inherit', ...options });
		child.on('error', reject);
		child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
	});
}
