// A background job's state in the words the tolerance panel shows: never "running" for a run
// that nothing is working on (a worker that stopped reporting reads "stalled"), and what the
// runner did on the way (taken over, resumed, handed back) as its own sentence.

export interface JobStatus {
	state: string;
	cancelRequested: boolean;
	attempt: number;
	maxAttempts: number;
	recovery: string | null;
	stale: boolean;
}

export function jobStateText(j: JobStatus): string {
	if (j.state === 'running' && j.cancelRequested) return 'cancelling…';
	if (j.state === 'running' && j.stale)
		return 'stalled: its worker has not reported for a while; another worker takes it over if it stays silent';
	if (j.state === 'running')
		return j.attempt > 1 ? `running (attempt ${j.attempt} of ${j.maxAttempts})` : 'running';
	if (j.state === 'queued') return 'queued, waiting for a worker';
	return j.state;
}

/** The runner's note as a sentence ("Attempt 1 stopped … resumes where it stopped."), or null. */
export function recoveryText(j: Pick<JobStatus, 'recovery'>): string | null {
	if (!j.recovery) return null;
	return `${j.recovery.charAt(0).toUpperCase()}${j.recovery.slice(1)}.`;
}
