import { api, ok } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';

export const GET = api((event) => ok({ user: requireUser(event), via: event.locals.via }));
