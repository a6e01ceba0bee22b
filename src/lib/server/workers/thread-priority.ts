// Solver threads yield the CPU to the thread that serves requests. Under a saturating analysis
// load the event loop — pages, saves, /api/health — must still get a core at once; on Linux a
// thread has its own nice value, so each worker thread lowers its own (the main thread keeps
// the process's). Elsewhere, or without permission, nothing changes.
import { readlinkSync } from 'node:fs';
import { getPriority, setPriority } from 'node:os';

/** Ten steps nicer than the process (as `nice -n 10`, relative: a server already started under
 * `nice` keeps the same gap); the server thread stays at the process's own value. */
export const WORKER_NICE = 10;

export function yieldToServerThread(nice = WORKER_NICE): boolean {
	try {
		// "/proc/thread-self" → "<pid>/task/<tid>": the id of this very thread.
		const tid = Number(readlinkSync('/proc/thread-self').split('/').pop());
		if (!Number.isInteger(tid) || tid <= 0) return false;
		setPriority(tid, Math.min(19, getPriority(tid) + nice));
		return true;
	} catch {
		return false;
	}
}
