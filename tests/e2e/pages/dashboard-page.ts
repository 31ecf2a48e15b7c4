// Page object of /dashboard for the browser tests: my manuscripts with my role, every manuscript for a site admin,
// and opening a manuscript from its card.
import type { Page } from 'playwright-core';

export class DashboardPage {
  constructor(readonly page: Page) {}

  /** Wait until the list of my manuscripts ('mine') or, for a site admin, of every manuscript ('all') is shown. */
  async waitForList(scope: 'mine' | 'all'): Promise<void> {
    await this.page.getByTestId(scope === 'all' ? 'manuscripts-all' : 'manuscripts-mine').waitFor();
  }

  /** How many "new manuscript" buttons and admin sections the page shows. */
  async controls(): Promise<{ newManuscript: number; adminSection: number }> {
    return {
      newManuscript: await this.page.getByTestId('new-manuscript').count(),
      adminSection: await this.page.getByTestId('admin-section').count(),
    };
  }

  /** The role badge on my card of the manuscript titled `title`. */
  async myRoleOn(title: string): Promise<string | null> {
    const card = this.page.getByTestId('manuscripts-mine').getByTestId('manuscript-card').filter({ hasText: title });
    return card.getByTestId('role-badge').textContent();
  }

  /** Wait for the empty state of "my manuscripts". */
  async waitForNoManuscripts(): Promise<void> {
    await this.page.getByText('No manuscripts yet').waitFor();
  }

  /** Open a manuscript from its link on the dashboard and wait for its page. */
  async openManuscript({ title, slug }: { title: string; slug: string }): Promise<void> {
    await this.page.getByRole('link', { name: new RegExp(title) }).click();
    await this.page.waitForURL(new RegExp(`/m/${slug}$`));
  }
}
