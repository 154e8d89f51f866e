import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { listDatasets } from '$lib/server/datasets';
import { CSV_MAX_COLUMNS, CSV_MAX_ROWS } from '$lib/server/csv';
import { env } from '$lib/server/env';

export const load: PageServerLoad = ({ locals }) => {
	const user = locals.user;
	if (!user) redirect(303, '/signin?next=/datasets');
	return {
		datasets: listDatasets(user),
		limits: { bytes: env.uploadMaxBytes, rows: CSV_MAX_ROWS, columns: CSV_MAX_COLUMNS },
		canUpload: user.role !== 'reader'
	};
};
