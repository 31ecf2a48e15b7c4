// Page object of an invitation link (/invite/<token>) for the browser tests: what it offers and the sign-up form
// that creates the account and joins the manuscript.
import type { Page } from 'playwright-core';

export class InvitationPage {
  constructor(readonly page: Page) {}

  async open(link: string): Promise<void> {
    await this.page.goto(link);
  }

  /** The title of the manuscript the invitation is for. */
  async manuscriptTitle(): Promise<string | null> {
    return this.page.getByTestId('invitation-title').textContent();
  }

  /** Fill the sign-up form and submit it (the caller waits for what should follow). */
  async signUp({ name, password }: { name: string; password: string }): Promise<void> {
    const form = this.page.getByTestId('sign-up-form');
    await form.getByLabel('Your name').fill(name);
    await form.getByLabel('Choose a password').fill(password);
    await form.getByRole('button', { name: 'Create account and join' }).click();
  }

  /** Wait for a field message of the sign-up form. */
  async waitForFormMessage(text: string): Promise<void> {
    await this.page.getByTestId('sign-up-form').getByText(text).waitFor();
  }

  async waitForAlreadyUsed(): Promise<void> {
    await this.page.getByText('This invitation has already been used.').waitFor();
  }
}
