import type { Bulk } from '../types';
import { makeBrane } from './brane';
import { readLength, rejectUnknownKeys } from './params';
import { HoloError } from '../errors';

/**
 * Thin-shell AdS–Vaidya (PHYSICS.md, "Quench"): pure AdS_{d+1} before boundary time 0, the brane of horizon zh
 * after it. Time-dependent answers (the key t) go through holo/vaidya; the slice, thermodynamics and stress tensor
 * given here are the final state's (the brane), which is what static questions about this bulk mean.
 */
export function makeVaidya(params: Record<string, number | string>): Bulk {
	rejectUnknownKeys('vaidya', params, ['d', 'zh']);
	const d = Number(params.d ?? 4);
	if (!Number.isInteger(d) || d < 2 || d > 6) throw new HoloError('vaidya needs an integer d from 2 to 6', 'd');
	const zh = readLength(params, 'zh');
	const brane = makeBrane({ d, zh });
	return { ...brane, name: 'vaidya', params: { d, zh }, series: undefined, firstLaw: undefined };
}
