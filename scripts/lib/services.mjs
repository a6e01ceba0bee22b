// Long-running helpers started next to the app: the app server itself, the dev server, and
// local fakes of hosted services. Each is a child process we stop on exit.
import { spawn } from 'node:child_process';
import path from 'node:path';

export function startChild(root, command, args, env, { name, stdio = 'inherit' } = {}) {
	const child = spawn(command, args, { cwd: root, env: { ...process.env, ...env }, stdio });
	child.name = name ?? command;
	return child;
}

/** tsx runs our TypeScript scripts directly (no build step for scripts). */
export function tsx(root) {
	return path.join(root, 'node_modules', '.bin', 'tsx');
}

export function stopChildren(children) {
	for (const child of children) {
		if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
	}
}
