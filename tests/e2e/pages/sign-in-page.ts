// Page object of /sign-in for the browser tests: the password form (which shares its page with the e-mail-link
// form) and the keyboard order of its fields.
import type { Page } from 'playwright-core';
import type { TestUser } from '../../helpers/test-users';

export class SignInPage {
  constructor(readonly page: Page) {}

  async open(): Promise<void> {
    await this.page.goto('/sign-in');
  }

  /** Sign in through the password form and wait for the dashboard. */
  async signIn(user: Pick<TestUser, 'email' | 'password'>): Promise<void> {
    await this.open();
    const form = this.page.getByTestId('password-form');
    await form.getByLabel('E-mail').fill(user.email);
    await form.getByLabel('Password').fill(user.password);
    await form.getByRole('button', { name: 'Sign in' }).click();
    await this.page.waitForURL(/\/dashboard$/);
  }

  /**
   * Press Tab from the top of the page (skip link, header links) until a form field has focus, at most `presses` times,
   * and describe the focused element.
   */
  async tabToFirstField(presses = 6): Promise<{ tag: string; name: string; label: string | null } | null> {
    for (let step = 0; step < presses; step++) {
      await this.page.keyboard.press('Tab');
      if (await this.page.evaluate(() => document.activeElement?.tagName === 'INPUT')) break;
    }
    return this.page.evaluate(() => {
      const element = document.activeElement as HTMLInputElement | null;
      return element ? { tag: element.tagName, name: element.name, label: element.labels?.[0]?.textContent ?? null } : null;
    });
  }
}
