// Waiting for e-mail in the fake SMTP server's mailbox (MAIL_DIR, written by scripts/smtp.mjs) and pulling links
// out of a message, for sign-in-link and invitation tests.
import { listMessages, type StoredMessage } from '@/lib/mail/mailbox';

export type { StoredMessage };

/**
 * Wait until a message to `email` arrives (polling MAIL_DIR), and return the newest one.
 *
 * @param email - recipient address (case-insensitive)
 * @param options.since - only messages received at or after this time (take `new Date()` before the action)
 * @param options.match - an extra condition, e.g. on the subject
 * @param options.timeoutMs - give up after this long (default 15 s) with an error listing what did arrive
 * @example
 * const before = new Date();
 * await client.post('/api/auth/signin/email', …);
 * const mail = await waitForMailTo('someone@example.org', { since: before });
 */
export async function waitForMailTo(
  email: string,
  {
    since,
    match,
    timeoutMs = 15_000,
    dir,
  }: { since?: Date; match?: (message: StoredMessage) => boolean; timeoutMs?: number; dir?: string } = {},
): Promise<StoredMessage> {
  const wanted = email.trim().toLowerCase();
  // The file name carries the arrival time in ms; allow 1 s of clock rounding between processes.
  const after = since ? since.getTime() - 1000 : -Infinity;
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const messages = await listMessages(dir);
    const found = messages.find(
      (m) =>
        m.to.some((to) => to.toLowerCase() === wanted) && m.receivedAt.getTime() >= after && (!match || match(m)),
    );
    if (found) return found;
    if (Date.now() > deadline) {
      const seen = messages.slice(0, 10).map((m) => `${m.to.join(',')}: ${m.subject}`);
      throw new Error(`no mail to ${email} within ${timeoutMs} ms; newest messages:\n  ${seen.join('\n  ') || '(none)'}`);
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

/** Every http(s) URL in the message's text part, in order. */
export function linksIn(message: Pick<StoredMessage, 'text'>): string[] {
  return [...message.text.matchAll(/https?:\/\/[^\s<>"')\]]+/g)].map((m) => m[0]);
}

/**
 * The first link whose path contains `fragment` (e.g. '/api/auth/callback/email' or '/invite/').
 *
 * @throws Error when there is none, quoting the text
 */
export function linkIn(message: Pick<StoredMessage, 'text'>, fragment: string): string {
  const link = linksIn(message).find((url) => url.includes(fragment));
  if (!link) throw new Error(`no link containing "${fragment}" in:\n${message.text}`);
  return link;
}

/**
 * Messages to `email` received at or after `since` (1 s tolerance for clock rounding), oldest first.
 *
 * @example
 * expect(await mailsTo(stranger, { since: before })).toHaveLength(1);
 */
export async function mailsTo(email: string, { since }: { since: Date }): Promise<StoredMessage[]> {
  const wanted = email.trim().toLowerCase();
  const after = since.getTime() - 1000;
  const messages = await listMessages();
  return messages.filter((m) => m.to.some((to) => to.toLowerCase() === wanted) && m.receivedAt.getTime() >= after).reverse();
}
