// Page object of a manuscript page (/m/<slug>) for the browser tests: its members, the controls a role gets
// (details form, invitations, owner actions, role selects, leave) and inviting someone.
import type { Page } from 'playwright-core';
import type { MemberRole } from '@/db/schema';

export interface ManuscriptControls {
  details: number;
  invite: number;
  ownerActions: number;
  roleSelects: number;
  leave: number;
}

export class ManuscriptPage {
  constructor(readonly page: Page) {}

  /** Go to the manuscript and wait for its member list. */
  async open(slug: string): Promise<void> {
    await this.page.goto(`/m/${slug}`);
    await this.waitForMembers();
  }

  async waitForMembers(): Promise<void> {
    await this.page.getByTestId('members').waitFor();
  }

  async title(): Promise<string | null> {
    return this.page.getByTestId('manuscript-title').textContent();
  }

  /** The role badge in the page header (the viewer's own role). */
  async myRole(): Promise<string | null> {
    return this.page.locator('header [data-testid="role-badge"]').first().textContent();
  }

  /** How many of each role-dependent control the page shows. */
  async controls(): Promise<ManuscriptControls> {
    return {
      details: await this.page.getByTestId('details-form').count(),
      invite: await this.page.getByTestId('invite-form').count(),
      ownerActions: await this.page.locator('#owner-actions').count(),
      roleSelects: await this.page.getByTestId('member-role-select').count(),
      leave: await this.page.getByTestId('leave').count(),
    };
  }

  /** Wait for the "Site admin" marker a site admin acting as owner sees. */
  async waitForSiteAdminMarker(): Promise<void> {
    await this.page.locator('main').getByText('Site admin', { exact: true }).waitFor();
  }

  /** Invite `email` in `role` through the invitation form and wait for the confirmation and the pending entry. */
  async invite(email: string, role: MemberRole): Promise<void> {
    const form = this.page.getByTestId('invite-form');
    await form.getByLabel('E-mail address').fill(email);
    await form.getByLabel('Role').selectOption(role);
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await this.page.getByText(`Invitation sent to ${email}`).waitFor();
    await this.page.getByTestId('pending-invitations').getByText(email).waitFor();
  }

  async pendingInvitationLists(): Promise<number> {
    return this.page.getByTestId('pending-invitations').count();
  }

  async waitForMember(name: string): Promise<void> {
    await this.page.getByTestId('members').getByText(name).first().waitFor();
  }

  /** How many CSS pixels the page sticks out sideways (0 or less when it fits the viewport). */
  async sidewaysOverflow(): Promise<number> {
    return this.page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  }
}
