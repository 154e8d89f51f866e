import { api, ok } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { deleteDataset, getDataset } from '$lib/server/datasets';

/** GET /api/datasets/[id] — the owner's dataset with its columns and every row. */
export const GET = api((event) => ok({ dataset: getDataset(requireUser(event), event.params.id!) }));

/** DELETE /api/datasets/[id] — the owner's; pads that compared against it keep their recorded results. */
export const DELETE = api((event) => {
	deleteDataset(requireWriter(event), event.params.id!);
	return ok({});
});
