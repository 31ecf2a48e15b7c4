// The type of "something that runs queries": the shared Drizzle instance or an open transaction,
// so that a query function can take part in a caller's transaction.
import type { db } from '@/db';

export type Transaction = Parameters<Parameters<typeof db.transaction>[0]>[0];
export type Executor = typeof db | Transaction;
