// The dev mailbox page (on in the test command: FLUXFOLIO_DEV_MAILBOX=1) shows the stored mail to site admins only;
// a signed-out visitor and a signed-in member get exactly the app's not-found page, like an unknown path.
import { beforeAll, describe, expect, it } from 'vitest';
import { AppClient, signInWithPassword } from '../helpers/app';
import { createTestUser, uniqueTag } from '../helpers/db';
import { waitForMailTo } from '../helpers/mail';
import { sendMail } from '@/lib/mail/send-mail';

/** The words a person sees: scripts, styles and tags removed, white space collapsed. */
function visibleText(html: string): string {
  return html
    .replace(/<script[\s\S]*?<\/script>/gi, ' ')
    .replace(/<style[\s\S]*?<\/style>/gi, ' ')
    .replace(/<[^>]+>/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

/** Status and visible text of a page for this client. */
async function page(client: AppClient, pathname: string): Promise<{ status: number; text: string }> {
  const response = await client.get(pathname);
  return { status: response.status, text: visibleText(await response.text()) };
}

const subject = `Mailbox check ${uniqueTag()}`;

beforeAll(async () => {
  const since = new Date();
  await sendMail({ to: 'mailbox.reader@tests.fluxfolio.example.org', subject, text: 'A message for the dev mailbox.' });
  await waitForMailTo('mailbox.reader@tests.fluxfolio.example.org', { since, match: (m) => m.subject === subject });
});

describe('dev mailbox page', () => {
  it('answers a signed-out visitor exactly like a missing page', async () => {
    const client = new AppClient();
    const missing = await page(client, `/no-such-page-${uniqueTag()}`);
    const mailbox = await page(client, '/dev/mailbox');
    expect(missing.status).toBe(404);
    expect(mailbox.status).toBe(404);
    expect(mailbox.text).toBe(missing.text);
    expect(mailbox.text).toMatch(/Nothing here/);
    expect(mailbox.text).not.toContain(subject);
  });

  it('answers a signed-in member who is not a site admin like a missing page', async () => {
    const member = await createTestUser({ label: 'mailbox-member' });
    const client = await signInWithPassword(member.email, member.password);
    const missing = await page(client, `/no-such-page-${uniqueTag()}`);
    const mailbox = await page(client, '/dev/mailbox');
    expect(mailbox.status).toBe(404);
    expect(mailbox.text).toBe(missing.text);
    expect(mailbox.text).not.toContain(subject);
  });

  it('shows the stored messages to a site admin', async () => {
    const admin = await createTestUser({ role: 'admin', label: 'mailbox-admin' });
    const client = await signInWithPassword(admin.email, admin.password);
    const mailbox = await page(client, '/dev/mailbox');
    expect(mailbox.status).toBe(200);
    expect(mailbox.text).toMatch(/Mailbox/);
    expect(mailbox.text).toContain(subject);
  });
});
