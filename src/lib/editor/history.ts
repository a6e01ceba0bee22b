// Undo/redo over immutable snapshots. Rapid edits of the same field (typing a value) fold into
// one step so Ctrl+Z takes back the whole edit, not one keystroke.
export class History<T> {
	past: T[] = [];
	future: T[] = [];
	private lastKey: string | null = null;
	private lastAt = 0;

	constructor(private readonly limit = 200) {}

	/** Record `before` as the state to return to, unless this edit continues the last one. */
	push(before: T, key?: string, now = Date.now()): void {
		const continues = key !== undefined && key === this.lastKey && now - this.lastAt < 2000;
		this.lastKey = key ?? null;
		this.lastAt = now;
		this.future = [];
		if (continues) return;
		this.past.push(before);
		if (this.past.length > this.limit) this.past.shift();
	}

	undo(current: T): T | null {
		const prev = this.past.pop();
		if (prev === undefined) return null;
		this.future.push(current);
		this.lastKey = null;
		return prev;
	}

	redo(current: T): T | null {
		const next = this.future.pop();
		if (next === undefined) return null;
		this.past.push(current);
		this.lastKey = null;
		return next;
	}

	clear(): void {
		this.past = [];
		this.future = [];
		this.lastKey = null;
	}
}
