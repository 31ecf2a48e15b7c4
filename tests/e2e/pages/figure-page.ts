// Page object of a figure page (/m/<slug>/figures/<label>) for the browser tests: the parameter form, Run with its
// progress bar, Freeze into the next snapshot, the snapshot list and Compare.
import type { Page } from 'playwright-core';

export class FigurePage {
  constructor(readonly page: Page) {}

  async open(manuscriptSlug: string, label: string): Promise<void> {
    await this.page.goto(`/m/${manuscriptSlug}/figures/${label}`);
  }

  async waitForRunPanel(): Promise<void> {
    await this.page.locator('[data-testid="run-panel"][data-ready]').waitFor();
  }

  /** Set a numeric field of the parameter form by its label. */
  async setParameter(label: string, value: string): Promise<void> {
    await this.page.getByTestId('params-form').getByLabel(label, { exact: true }).fill(value);
  }

  /** Press Run (which saves the form first), see the progress bar, and wait until the finished run can be frozen. */
  async runAndWait(timeoutMs: number): Promise<void> {
    await this.page.getByTestId('run-button').click();
    await this.page.getByTestId('run-progress').waitFor();
    await this.page.getByTestId('freeze-button').filter({ hasText: 'Freeze as snapshot' }).waitFor({ timeout: timeoutMs });
  }

  /** Press Freeze; the caller polls {@link frozenMessage} for the version. */
  async freeze(): Promise<void> {
    await this.page.getByTestId('freeze-button').click();
  }

  async frozenMessage(): Promise<string> {
    return (await this.page.getByTestId('frozen-message').textContent()) ?? '';
  }

  /** The address of the snapshot the freeze message links to. */
  async frozenSnapshotHref(): Promise<string | null> {
    return this.page.getByTestId('frozen-message').locator('a').getAttribute('href');
  }

  async waitForSnapshot(version: number): Promise<void> {
    await this.page.getByTestId(`snapshot-v${version}`).waitFor();
  }

  /** Open the comparison of the two latest snapshots and wait for its chart. */
  async compare(): Promise<void> {
    await this.page.getByTestId('compare-link').click();
    await this.page.waitForURL(/\/compare\?/);
    await this.page.locator('[data-testid="chart"] svg').first().waitFor();
  }

  async parameterDiff(): Promise<string> {
    return (await this.page.getByTestId('param-diff').textContent()) ?? '';
  }

  async waitForReadOnlyParameters(): Promise<void> {
    await this.page.getByTestId('params-readonly').waitFor();
  }

  /** How many of each editing control the page shows (a coauthor sees the read-only parameters instead). */
  async controls(): Promise<{ form: number; readonly: number; run: number; freeze: number }> {
    return {
      form: await this.page.getByTestId('params-form').count(),
      readonly: await this.page.getByTestId('params-readonly').count(),
      run: await this.page.getByTestId('run-button').count(),
      freeze: await this.page.getByTestId('freeze-button').count(),
    };
  }
}
