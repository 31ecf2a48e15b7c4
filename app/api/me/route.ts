// GET: the signed-in user (id, name, e-mail, site-admin flag); 401 without a session.
// Values come from the database, not from the session token.
import { route } from '@/lib/http/handler';

export const GET = route({}, async ({ user }) => ({ user }));
