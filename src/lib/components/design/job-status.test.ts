import { describe, expect, it } from 'vitest';
import { jobStateText, recoveryText, type JobStatus } from './job-status';

const job = (over: Partial<JobStatus>): JobStatus => ({
	state: 'running',
	cancelRequested: false,
	attempt: 1,
	maxAttempts: 3,
	recovery: null,
	stale: false,
	...over
});

describe('a job’s state in words', () => {
	it.each([
		[job({}), 'running'],
		[job({ attempt: 2 }), 'running (attempt 2 of 3)'],
		[
			job({ stale: true }),
			'stalled: its worker has not reported for a while; another worker takes it over if it stays silent'
		],
		[job({ cancelRequested: true, stale: true }), 'cancelling…'],
		[job({ state: 'queued', attempt: 1 }), 'queued, waiting for a worker'],
		[job({ state: 'failed' }), 'failed'],
		[job({ state: 'done', attempt: 2 }), 'done']
	])('%#: %s', (j, says) => {
		expect(jobStateText(j)).toBe(says);
	});

	it('a stalled job is never called running', () => {
		expect(jobStateText(job({ stale: true }))).not.toMatch(/^running/);
	});

	it('the runner’s note becomes a sentence; none without one', () => {
		expect(
			recoveryText({
				recovery:
					'attempt 1 stopped (its process ended) at 2,750 of 10,000; resumes where it stopped'
			})
		).toBe('Attempt 1 stopped (its process ended) at 2,750 of 10,000; resumes where it stopped.');
		expect(recoveryText({ recovery: null })).toBeNull();
	});
});
