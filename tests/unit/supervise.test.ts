// npm start's supervision of the app process (scripts/lib/supervise.mjs), with real child
// processes that exit or are killed: restarted with a doubling pause and a message, never
// restarted after a settings refusal (exit 78) or once stopped.
import { spawn } from 'node:child_process';
import { describe, expect, it } from 'vitest';
// @ts-expect-error plain ESM bootstrap helper without type declarations
import { supervise } from '../../scripts/lib/supervise.mjs';

const node = (code: string) => () => spawn(process.execPath, ['-e', code], { stdio: 'ignore' });
const sleep = (ms: number) => new Promise((ok) => setTimeout(ok, ms));

async function untilLogged(lines: string[], count: number) {
	for (let i = 0; i < 200 && lines.length < count; i++) await sleep(25);
}

describe('supervision of the app process', () => {
	it('restarts a process that exits, with a doubling pause and a message each time', async () => {
		const lines: string[] = [];
		let starts = 0;
		const s = supervise({
			start: () => (starts++, node('process.exit(3)')()),
			log: (m: string) => lines.push(m),
			firstDelayMs: 50
		});
		await untilLogged(lines, 3);
		await s.stop();
		expect(lines.slice(0, 3)).toEqual([
			'The app process exited with code 3; restarting it in 0.05 s (the database stays up).',
			'The app process exited with code 3; restarting it in 0.1 s (the database stays up).',
			'The app process exited with code 3; restarting it in 0.2 s (the database stays up).'
		]);
		const after = starts;
		await sleep(500);
		expect(starts).toBe(after); // stopped: nothing starts again
	});

	it('says when the process was killed, and restarts it', async () => {
		const lines: string[] = [];
		const s = supervise({
			start: node('setInterval(() => {}, 1000)'),
			log: (m: string) => lines.push(m),
			firstDelayMs: 50
		});
		await sleep(200);
		s.current().kill('SIGKILL');
		await untilLogged(lines, 1);
		expect(lines[0]).toBe(
			'The app process was killed (SIGKILL); restarting it in 0.05 s (the database stays up).'
		);
		await sleep(200);
		const again = s.current();
		expect(again.exitCode).toBeNull(); // a new process, running
		await s.stop();
		expect(again.signalCode).toBe('SIGTERM');
	});

	it('does not restart a process that refused its settings (exit 78), and ends supervision with that code', async () => {
		const lines: string[] = [];
		let starts = 0;
		const s = supervise({
			start: () => (starts++, node('process.exit(78)')()),
			log: (m: string) => lines.push(m),
			firstDelayMs: 50
		});
		expect(await s.done).toBe(78);
		await sleep(300);
		expect(starts).toBe(1);
		expect(lines).toEqual([
			'The app process refused to start because a setting is wrong (see above); fix it and start again.'
		]);
	});
});
