// Page object of a snapshot page (/s/<id>) for the browser tests: the stable address of a frozen figure, with its
// content hash, its BibTeX entry and its chart.
import type { Page } from 'playwright-core';

export class SnapshotPage {
  constructor(readonly page: Page) {}

  /** Go to the snapshot and wait for its chart. */
  async open(href: string): Promise<void> {
    await this.page.goto(href);
    await this.page.locator('[data-testid="chart"] svg').first().waitFor();
  }

  async resultHash(): Promise<string> {
    return (await this.page.getByTestId('result-hash').textContent()) ?? '';
  }

  async bibtex(): Promise<string> {
    return (await this.page.getByTestId('bibtex').textContent()) ?? '';
  }
}
