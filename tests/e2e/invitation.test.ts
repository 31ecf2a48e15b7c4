// The invitation flow end to end in the browser: an owner invites a new address as coauthor, the e-mail arrives
// at the fake SMTP server, a fresh browser opens its link, signs up, and lands on the manuscript as a coauthor
// who sees no owner controls.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sqlClient } from '@/db';
import { getUserByEmail } from '@/db/queries/users';
import { launchBrowser, newPage, screenshot } from '../helpers/browser';
import { RUN_TAG } from '../helpers/db';
import { APP_URL } from '../helpers/http-client';
import { linkIn, waitForMailTo } from '../helpers/mail';
import { getMembershipRole } from '../helpers/manuscript-rows';
import { createTestManuscript } from '../helpers/test-manuscripts';
import { createTestUser, type TestUser } from '../helpers/test-users';
import { DashboardPage } from './pages/dashboard-page';
import { InvitationPage } from './pages/invitation-page';
import { ManuscriptPage } from './pages/manuscript-page';
import { SignInPage } from './pages/sign-in-page';

let browser: Browser;
let owner: TestUser;
let manuscript: { id: string; slug: string; title: string };

beforeAll(async () => {
  browser = await launchBrowser();
  owner = await createTestUser({ label: 'invite-owner' });
  manuscript = await createTestManuscript({ title: 'Persistent currents in a threaded ring', owner });
});

afterAll(async () => {
  await browser?.close();
  await sqlClient.end({ timeout: 5 });
});

describe('invitation flow', () => {
  it('invites a new address as coauthor, who signs up from the e-mail link and sees a coauthor view', async () => {
    const inviteeEmail = `invitee.${RUN_TAG}@fluxfolio.test`;

    // The owner invites.
    const ownerPage = await newPage(browser);
    await new SignInPage(ownerPage).signIn(owner);
    const dashboard = new DashboardPage(ownerPage);
    await dashboard.waitForList('mine');
    await dashboard.openManuscript(manuscript);
    const ownerView = new ManuscriptPage(ownerPage);
    const since = new Date();
    await ownerView.invite(inviteeEmail, 'coauthor');
    await screenshot(ownerPage, 'invitation-owner-sent');

    // The e-mail arrives at the fake SMTP server.
    const mail = await waitForMailTo(inviteeEmail, { since });
    expect(mail.subject).toContain(manuscript.title);
    const link = linkIn(mail, '/invite/');
    expect(new URL(link).origin).toBe(new URL(APP_URL).origin);

    // A new browser (no session) opens the link and signs up; a short password is refused first.
    const inviteePage = await newPage(browser, { viewport: { width: 390, height: 844 } });
    const invitation = new InvitationPage(inviteePage);
    await invitation.open(link);
    expect(await invitation.manuscriptTitle()).toBe(manuscript.title);
    await invitation.signUp({ name: 'Ilse Invitee', password: 'short' });
    await invitation.waitForFormMessage('At least 10 characters');
    await screenshot(inviteePage, 'invitation-invitee-sign-up');
    await invitation.signUp({ name: 'Ilse Invitee', password: 'a long enough passphrase' });

    // Lands on the manuscript, signed in, as coauthor, without owner or author controls.
    await inviteePage.waitForURL(new RegExp(`/m/${manuscript.slug}$`));
    const inviteeView = new ManuscriptPage(inviteePage);
    expect(await inviteeView.title()).toBe(manuscript.title);
    await inviteeView.waitForMember('Ilse Invitee');
    expect(await inviteeView.myRole()).toBe('Coauthor');
    expect(await inviteeView.controls()).toEqual({ details: 0, invite: 0, ownerActions: 0, roleSelects: 0, leave: 1 });
    await screenshot(inviteePage, 'invitation-invitee-landed');
    // Nothing sticks out sideways on a phone-sized screen (long e-mail addresses are truncated).
    expect(await inviteeView.sidewaysOverflow()).toBeLessThanOrEqual(0);

    const user = await getUserByEmail({ email: inviteeEmail });
    expect(user).not.toBeNull();
    expect(user!.name).toBe('Ilse Invitee');
    expect(user!.emailVerified).toBeInstanceOf(Date);
    expect(await getMembershipRole(manuscript.id, user!.id)).toBe('coauthor');

    // The link cannot be used a second time.
    const thirdPage = await newPage(browser);
    const again = new InvitationPage(thirdPage);
    await again.open(link);
    await again.waitForAlreadyUsed();

    // The owner's member list now shows the coauthor, and no pending invitation.
    await ownerPage.reload();
    await ownerView.waitForMember('Ilse Invitee');
    expect(await ownerView.pendingInvitationLists()).toBe(0);

    await Promise.all([ownerPage.context().close(), inviteePage.context().close(), thirdPage.context().close()]);
  });
});
