// Keep one app process running for `npm start` / `npm run dev`: when it dies it is started again
// after a pause that doubles with each quick failure (1 s, 2 s, 4 s … 30 s; back to 1 s once it
// has run a minute), saying so. The database and the mail catcher stay up meanwhile, so other
// processes using them are not taken down with it. Exit code 78 (a setting is wrong: the app
// said which) is not retried: restarting cannot fix it.
import { info } from './log.mjs';

export const EX_CONFIG = 78;

export function supervise({ start, name = 'app', log = (m) => info(m), firstDelayMs = 1000, maxDelayMs = 30_000, healthyAfterMs = 60_000 }) {
	let stopped = false;
	let child = null;
	let timer = null;
	let delay = firstDelayMs;
	let finish;
	const done = new Promise((resolve) => (finish = resolve));

	const launch = () => {
		if (stopped) return;
		const startedAt = Date.now();
		child = start();
		child.once('exit', (code, signal) => {
			// Ctrl-C reaches this process and the app together: let our own handler run first.
			setTimeout(() => {
				if (stopped) return;
				if (code === EX_CONFIG) {
					log(`The ${name} process refused to start because a setting is wrong (see above); fix it and start again.`);
					stopped = true;
					finish(EX_CONFIG);
					return;
				}
				if (Date.now() - startedAt >= healthyAfterMs) delay = firstDelayMs;
				const how = signal ? `was killed (${signal})` : `exited with code ${code}`;
				log(`The ${name} process ${how}; restarting it in ${delay / 1000} s (the database stays up).`);
				timer = setTimeout(launch, delay);
				delay = Math.min(delay * 2, maxDelayMs);
			}, 100);
		});
	};
	launch();

	return {
		done,
		current: () => child,
		/** Stop supervising and end the process (SIGTERM); resolves when it has exited. */
		stop() {
			stopped = true;
			if (timer) clearTimeout(timer);
			const c = child;
			finish(0);
			if (!c || c.exitCode !== null || c.signalCode !== null) return Promise.resolve();
			return new Promise((resolve) => {
				c.once('exit', resolve);
				c.kill('SIGTERM');
			});
		}
	};
}
