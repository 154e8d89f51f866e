/** The shapes the library, dataset and key pages read from their loads and the JSON API. */
export type MacroState = 'proposed' | 'approved' | 'retired';

export interface MacroItem {
	id: string;
	name: string;
	description: string;
	state: MacroState;
	version: number;
	params: Record<string, string>;
	body: string[];
	/** the header: what the macro may leave changed in the pad (the rest is put back after it runs) */
	effects: ('bulk' | 'units')[];
	author: { name: string };
	mine: boolean;
	updatedAt: string | Date;
}

export interface MacroVersion {
	version: number;
	params: Record<string, string>;
	body: string[];
	editedBy: { name: string };
	createdAt: string;
}

/** POST /api/macros/[id]/trial: the macro on its example parameters in a fresh pad. */
export type MacroTrial = {
	input: string;
	version: number;
	params: Record<string, string>;
	effects: ('bulk' | 'units')[];
	before: { bulk: { name: string; params: Record<string, unknown> }; units: Record<string, unknown> };
	ms: number;
} & (
	| {
			ok: true;
			results: import('$lib/lang/result').Result[];
			after: { bulk: { name: string; params: Record<string, unknown> }; units: Record<string, unknown> };
	  }
	| { ok: false; error: { message: string } }
);
