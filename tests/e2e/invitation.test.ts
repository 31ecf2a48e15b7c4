// The invitation flow end to end in the browser: an owner invites a new address as coauthor, the e-mail arrives
// at the fake SMTP server, a fresh browser opens its link, signs up, and lands on the manuscript as a coauthor
// who sees no owner controls.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sqlClient } from '@/db';
import { getUserByEmail } from '@/db/queries/users';
import {
  APP_URL,
  createManuscript,
  createUser,
  getMembershipRole,
  RUN,
  waitForMailTo,
  type TestUser,
} from '../api/web-support';
import { launchBrowser, screenshot, signInThroughForm } from './web-browser';

let browser: Browser;
let owner: TestUser;
let manuscript: { id: string; slug: string; title: string };

beforeAll(async () => {
  browser = await launchBrowser();
  owner = await createUser({ label: 'invite-owner' });
  manuscript = await createManuscript({
    title: 'Persistent currents in a threaded ring',
    members: [{ user: owner, role: 'owner' }],
  });
});

afterAll(async () => {
  await browser?.close();
  await sqlClient.end({ timeout: 5 });
});

describe('invitation flow', () => {
  it('invites a new address as coauthor, who signs up from the e-mail link and sees a coauthor view', async () => {
    const inviteeEmail = `invitee.${RUN}@fluxfolio.test`;

    // The owner invites.
    const ownerContext = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const ownerPage = await ownerContext.newPage();
    await signInThroughForm(ownerPage, owner.email);
    await ownerPage.getByTestId('manuscripts-mine').waitFor();
    await ownerPage.getByRole('link', { name: new RegExp(manuscript.title) }).click();
    await ownerPage.waitForURL(new RegExp(`/m/${manuscript.slug}$`));
    const inviteForm = ownerPage.getByTestId('invite-form');
    await inviteForm.getByLabel('E-mail address').fill(inviteeEmail);
    await inviteForm.getByLabel('Role').selectOption('coauthor');
    const since = Date.now();
    await inviteForm.getByRole('button', { name: 'Send invitation' }).click();
    await ownerPage.getByText(`Invitation sent to ${inviteeEmail}`).waitFor();
    await ownerPage.getByTestId('pending-invitations').getByText(inviteeEmail).waitFor();
    await screenshot(ownerPage, 'invitation-owner-sent');

    // The e-mail arrives at the fake SMTP server.
    const mail = await waitForMailTo(inviteeEmail, since);
    expect(mail.subject).toContain(manuscript.title);
    const link = mail.links.find((url) => url.includes('/invite/'));
    expect(link, mail.raw).toBeTruthy();
    expect(new URL(link!).origin).toBe(new URL(APP_URL).origin);

    // A new browser (no session) opens the link and signs up.
    const inviteeContext = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const inviteePage = await inviteeContext.newPage();
    await inviteePage.goto(link!);
    await expect(inviteePage.getByTestId('invitation-title').textContent()).resolves.toBe(manuscript.title);
    const signUp = inviteePage.getByTestId('sign-up-form');
    await signUp.getByLabel('Your name').fill('Ilse Invitee');
    await signUp.getByLabel('Choose a password').fill('short');
    await signUp.getByRole('button', { name: 'Create account and join' }).click();
    await signUp.getByText('At least 10 characters').waitFor();
    await signUp.getByLabel('Choose a password').fill('a long enough passphrase');
    await screenshot(inviteePage, 'invitation-invitee-sign-up');
    await signUp.getByRole('button', { name: 'Create account and join' }).click();

    // Lands on the manuscript, signed in, as coauthor, without owner or author controls.
    await inviteePage.waitForURL(new RegExp(`/m/${manuscript.slug}$`));
    await expect(inviteePage.getByTestId('manuscript-title').textContent()).resolves.toBe(manuscript.title);
    await inviteePage.getByTestId('members').getByText('Ilse Invitee').first().waitFor();
    await expect(inviteePage.locator('header [data-testid="role-badge"]').first().textContent()).resolves.toBe('Coauthor');
    expect(await inviteePage.getByTestId('invite-form').count()).toBe(0);
    expect(await inviteePage.getByTestId('details-form').count()).toBe(0);
    expect(await inviteePage.locator('#owner-actions').count()).toBe(0);
    expect(await inviteePage.getByTestId('member-role-select').count()).toBe(0);
    expect(await inviteePage.getByTestId('leave').count()).toBe(1);
    await screenshot(inviteePage, 'invitation-invitee-landed');
    // Nothing sticks out sideways on a phone-sized screen (long e-mail addresses are truncated).
    expect(await inviteePage.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);

    const user = await getUserByEmail({ email: inviteeEmail });
    expect(user?.name).toBe('Ilse Invitee');
    expect(user?.emailVerified).toBeInstanceOf(Date);
    expect(await getMembershipRole(manuscript.id, user!.id)).toBe('coauthor');

    // The link cannot be used a second time.
    const thirdContext = await browser.newContext();
    const thirdPage = await thirdContext.newPage();
    await thirdPage.goto(link!);
    await thirdPage.getByText('This invitation has already been used.').waitFor();

    // The owner's member list now shows the coauthor, and no pending invitation.
    await ownerPage.reload();
    await ownerPage.getByTestId('members').getByText('Ilse Invitee').first().waitFor();
    expect(await ownerPage.getByTestId('pending-invitations').count()).toBe(0);

    await Promise.all([ownerContext.close(), inviteeContext.close(), thirdContext.close()]);
  });
});
