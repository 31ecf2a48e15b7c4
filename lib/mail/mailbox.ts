// Read the messages the local fake SMTP server (scripts/smtp.mjs) stored in MAIL_DIR as JSON files,
// for the dev mailbox page and the tests. Newest first.
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { z } from 'zod';
import { mailDir } from '@/lib/env';

/** One stored message, as scripts/smtp.mjs writes it. */
export const storedMessageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  date: z.string(),
});
/** A stored message plus its file name and arrival time (from the file name, millisecond resolution). */
export type StoredMessage = z.infer<typeof storedMessageSchema> & { file: string; receivedAt: Date };

/** `2026-01-31T12-00-00-123Z-000001-abc.json` -> the Date 2026-01-31T12:00:00.123Z (or the message date). */
function arrivalTime(file: string, fallback: string): Date {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2})-(\d{2})-(\d{2})-(\d{3})Z/.exec(file);
  return new Date(m ? `${m[1]}T${m[2]}:${m[3]}:${m[4]}.${m[5]}Z` : fallback);
}

/**
 * Every stored message, newest first. Files that are not valid messages (half-written, foreign) are skipped.
 *
 * @param dir - the mailbox folder (default: MAIL_DIR resolved against the working directory)
 * @example
 * const [latest] = await listMessages();
 */
export async function listMessages(dir: string = mailDir()): Promise<StoredMessage[]> {
  let names: string[];
  try {
    names = (await readdir(dir)).filter((name) => name.endsWith('.json'));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  const messages: StoredMessage[] = [];
  for (const name of names) {
    try {
      const parsed = storedMessageSchema.safeParse(JSON.parse(await readFile(path.join(dir, name), 'utf8')));
      if (parsed.success) messages.push({ ...parsed.data, file: name, receivedAt: arrivalTime(name, parsed.data.date) });
    } catch {
      // Being written right now, or not ours: skip.
    }
  }
  // File names start with a sortable timestamp; the date field breaks no ties better than the name does.
  return messages.sort((a, b) => (a.file < b.file ? 1 : a.file > b.file ? -1 : 0));
}

/**
 * The newest message addressed to `email` (compared case-insensitively), or null.
 *
 * @example
 * const mail = await latestMessageTo('new.person@example.org');
 */
export async function latestMessageTo(email: string, dir: string = mailDir()): Promise<StoredMessage | null> {
  const wanted = email.trim().toLowerCase();
  const messages = await listMessages(dir);
  return messages.find((m) => m.to.some((to) => to.toLowerCase() === wanted)) ?? null;
}

/** One message by id, or null. */
export async function getMessageById(id: string, dir: string = mailDir()): Promise<StoredMessage | null> {
  return (await listMessages(dir)).find((m) => m.id === id) ?? null;
}
