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
