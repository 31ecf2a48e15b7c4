// The invitation rules of lib/invitations against the real test database: who may accept (the invited address
// only), used and expired links, the role the member ends up with (never lowered), and inviting a member again.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { saveMembership } from '@/db/queries/members';
import { getUserByEmail } from '@/db/queries/users';
import { acceptInvitation } from '@/lib/invitations/accept-invitation';
import { createInvitation, INVITATION_LIFETIME_MS } from '@/lib/invitations/create-invitation';
import { getInvitationByToken } from '@/lib/invitations/get-invitation';
import { RUN_TAG } from '../helpers/db';
import { getManuscriptRow, getMembershipRole } from '../helpers/manuscript-rows';
import { createTestManuscript } from '../helpers/test-manuscripts';
import { createTestUser, type TestUser } from '../helpers/test-users';

let owner: TestUser;
let author: TestUser;
let coauthor: TestUser;
let stranger: TestUser;
let manuscript: { id: string };

beforeAll(async () => {
  [owner, author, coauthor, stranger] = await Promise.all(
    ['rules-owner', 'rules-author', 'rules-coauthor', 'rules-stranger'].map((label) => createTestUser({ label })),
  );
  manuscript = await createTestManuscript({
    title: 'Invitation rules',
    members: [
      { user: owner, role: 'owner' },
      { user: author, role: 'author' },
    ],
  });
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

const invite = (email: string, role: 'owner' | 'author' | 'coauthor', now?: Date) =>
  createInvitation({ manuscriptId: manuscript.id, email, role, invitedById: owner.id, now });

describe('accepting', () => {
  it('refuses a signed-in person whose address is not the invited one, and adds nobody', async () => {
    const { token } = await invite(coauthor.email, 'coauthor');
    await expect(acceptInvitation({ token, user: stranger })).rejects.toMatchObject({
      code: 'forbidden',
      message: `This invitation was sent to ${coauthor.email}; sign in with that address to accept it`,
    });
    expect(await getMembershipRole(manuscript.id, stranger.id)).toBeNull();
    expect((await getInvitationByToken({ token }))?.acceptedAt).toBeNull();
  });

  it('lets the invited address join in the invited role (case of the address ignored), once', async () => {
    const { token } = await invite(coauthor.email.toUpperCase(), 'coauthor');
    const before = (await getManuscriptRow(manuscript.id))!.updatedAt;
    const accepted = await acceptInvitation({ token, user: { id: coauthor.id, email: coauthor.email.toUpperCase() } });
    expect(accepted).toMatchObject({ manuscriptId: manuscript.id, role: 'coauthor', userId: coauthor.id, accountCreated: false });
    expect(await getMembershipRole(manuscript.id, coauthor.id)).toBe('coauthor');
    expect((await getManuscriptRow(manuscript.id))!.updatedAt.getTime()).toBeGreaterThan(before.getTime());

    // The same person again: a no-op answering with their membership. Anyone else: the link is used.
    await expect(acceptInvitation({ token, user: coauthor })).resolves.toMatchObject({ role: 'coauthor', userId: coauthor.id });
    await expect(acceptInvitation({ token, user: stranger })).rejects.toMatchObject({
      code: 'conflict',
      message: 'This invitation has already been used',
    });
  });

  it('never lowers a role: a person who became author meanwhile stays author; a coauthor invited as owner is raised', async () => {
    const lower = await createTestUser({ label: 'rules-lower' });
    const { token: coauthorLink } = await invite(lower.email, 'coauthor');
    await saveMembership({ manuscriptId: manuscript.id, userId: lower.id, role: 'author' });
    await expect(acceptInvitation({ token: coauthorLink, user: lower })).resolves.toMatchObject({ role: 'author' });
    expect(await getMembershipRole(manuscript.id, lower.id)).toBe('author');

    const raised = await createTestUser({ label: 'rules-raise' });
    const { token: ownerLink } = await invite(raised.email, 'owner');
    await saveMembership({ manuscriptId: manuscript.id, userId: raised.id, role: 'coauthor' });
    await expect(acceptInvitation({ token: ownerLink, user: raised })).resolves.toMatchObject({ role: 'owner' });
    expect(await getMembershipRole(manuscript.id, raised.id)).toBe('owner');
  });
});

describe('inviting', () => {
  it('refuses to invite a member, with a message on the e-mail field', async () => {
    await expect(invite(author.email.toUpperCase(), 'coauthor')).rejects.toMatchObject({
      code: 'conflict',
      message: 'This person is already a member of the manuscript',
      fields: { email: ['Already a member'] },
    });
  });

  it('replaces the pending invitation of the same address: the old link stops working', async () => {
    const person = await createTestUser({ label: 'rules-replace' });
    const first = await invite(person.email, 'author');
    const second = await invite(person.email, 'coauthor');
    expect(await getInvitationByToken({ token: first.token })).toBeNull();
    await expect(acceptInvitation({ token: first.token, user: person })).rejects.toMatchObject({ code: 'not-found' });
    await expect(acceptInvitation({ token: second.token, user: person })).resolves.toMatchObject({ role: 'coauthor' });
  });
});

describe('links that cannot be accepted', () => {
  it('refuses an expired link with a conflict that says to ask again', async () => {
    const longAgo = new Date(Date.now() - INVITATION_LIFETIME_MS - 60_000);
    const { token } = await invite(`expired.${RUN_TAG}@tests.fluxfolio.example.org`, 'coauthor', longAgo);
    expect((await getInvitationByToken({ token }))?.expired).toBe(true);
    await expect(
      acceptInvitation({ token, signUp: { name: 'Late Reader', passwordHash: 'not-used' } }),
    ).rejects.toMatchObject({
      code: 'conflict',
      message: 'This invitation has expired; ask an owner of the manuscript to invite you again',
    });
    expect(await getUserByEmail({ email: `expired.${RUN_TAG}@tests.fluxfolio.example.org` })).toBeNull();
  });

  it('signs up a new address (verified by the link) but refuses sign-up for an address that has an account', async () => {
    const fresh = `fresh.${RUN_TAG}@tests.fluxfolio.example.org`;
    const { token } = await invite(fresh, 'author');
    const accepted = await acceptInvitation({ token, signUp: { name: 'New Author', passwordHash: 'hash-from-test' } });
    expect(accepted).toMatchObject({ role: 'author', email: fresh, accountCreated: true });
    const created = await getUserByEmail({ email: fresh });
    expect(created?.emailVerified).toBeInstanceOf(Date);
    expect(await getMembershipRole(manuscript.id, created!.id)).toBe('author');

    const { token: strangerToken } = await invite(stranger.email, 'coauthor');
    await expect(
      acceptInvitation({ token: strangerToken, signUp: { name: 'Copycat', passwordHash: 'hash-from-test' } }),
    ).rejects.toMatchObject({
      code: 'conflict',
      message: 'An account already uses this e-mail address; sign in to accept the invitation',
    });
    expect(await getMembershipRole(manuscript.id, stranger.id)).toBeNull();
  });

  it('answers an unknown token with not-found', async () => {
    await expect(acceptInvitation({ token: 'A'.repeat(43), user: stranger })).rejects.toMatchObject({
      code: 'not-found',
      message: 'This invitation does not exist or was replaced by a newer one',
    });
  });
});
