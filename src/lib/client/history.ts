/**
 * Up/Down recall of typed lines. The pad's history comes from the server (oldest first, failed lines too);
 * lines typed here are appended. What the user was typing before walking back is kept as the draft and
 * comes back after the newest entry, as in a shell.
 */
export class LineHistory {
	private entries: string[];
	private cursor: number;
	private draft = '';

	constructor(
		entries: string[] = [],
		private max = 200
	) {
		this.entries = entries.slice(-max);
		this.cursor = this.entries.length;
	}

	get all(): readonly string[] {
		return this.entries;
	}

	/** Records a submitted line; repeats of the newest entry are kept once. */
	push(line: string) {
		if (line.trim() && this.entries.at(-1) !== line) this.entries.push(line);
		if (this.entries.length > this.max) this.entries.splice(0, this.entries.length - this.max);
		this.cursor = this.entries.length;
		this.draft = '';
	}

	/** The older line, or undefined at the oldest. `current` is what the input holds now. */
	up(current: string): string | undefined {
		if (this.cursor === 0) return undefined;
		if (this.cursor === this.entries.length) this.draft = current;
		this.cursor--;
		return this.entries[this.cursor];
	}

	/** The newer line, the draft after the newest, or undefined when already at the draft. */
	down(): string | undefined {
		if (this.cursor >= this.entries.length) return undefined;
		this.cursor++;
		return this.cursor === this.entries.length ? this.draft : this.entries[this.cursor];
	}

	reset() {
		this.cursor = this.entries.length;
		this.draft = '';
	}
}
