/**
 * Up/Down recall of typed lines. The pad's history comes from the server (oldest first, failed lines too);
 * lines typed here are appended. What the user had typed before walking back is kept as the draft and is
 * also the search: Up and Down visit only the lines that start with it (an empty draft visits them all), and
 * the draft comes back after the newest match, as in a shell's prefix search.
 */
export class LineHistory {
	private entries: string[];
	private cursor: number;
	private draft = '';
	/** what the input held before walking back (differs from the search when a selected line was searched past) */
	private draftText = '';

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
		this.reset();
	}

	private matches(i: number, shown: string): boolean {
		const e = this.entries[i]!;
		return e.startsWith(this.draft) && e !== shown;
	}

	/**
	 * The next older line starting with the draft, or undefined when there is none. `current` is what the input
	 * holds now; on the first step back it becomes the draft. `prefix` overrides the search (the console passes
	 * '' when the whole line is selected, so Up after an error walks the full history).
	 */
	up(current: string, prefix = current): string | undefined {
		if (this.cursor === this.entries.length) this.draft = prefix;
		const keep = this.cursor === this.entries.length ? current : undefined;
		for (let i = this.cursor - 1; i >= 0; i--) {
			if (!this.matches(i, current)) continue;
			if (keep !== undefined) this.draftText = keep;
			this.cursor = i;
			return this.entries[i];
		}
		return undefined;
	}

	/** The next newer matching line, the draft after the newest, or undefined when already at the draft. */
	down(): string | undefined {
		if (this.cursor >= this.entries.length) return undefined;
		const shown = this.entries[this.cursor]!;
		for (let i = this.cursor + 1; i < this.entries.length; i++) {
			if (!this.matches(i, shown)) continue;
			this.cursor = i;
			return this.entries[i];
		}
		this.cursor = this.entries.length;
		return this.draftText;
	}

	reset() {
		this.cursor = this.entries.length;
		this.draft = '';
		this.draftText = '';
	}
}
