// Page object of a figure note as read (/m/<slug>/notes/<note>) for the browser tests: its body, its figure blocks
// (live or pinned to a snapshot version) and starting a run from a block.
import type { Locator, Page } from 'playwright-core';

export class NotePage {
  constructor(readonly page: Page) {}

  /** Go to the note and wait for its body. */
  async open(manuscriptSlug: string, noteSlug: string): Promise<void> {
    await this.page.goto(`/m/${manuscriptSlug}/notes/${noteSlug}`);
    await this.page.getByTestId('note-body').waitFor();
  }

  /** A figure block: the live one (`version` 'latest') or one pinned to a snapshot version. */
  block(label: string, version?: number | 'latest'): Locator {
    const pinned = version === undefined ? '' : `[data-version="${version}"]`;
    return this.page.locator(`[data-figure="${label}"]${pinned}`);
  }

  /** Start a run from the block, see its progress bar, and wait (up to `timeoutMs`) for the chart it draws. */
  async runBlock(label: string, timeoutMs: number): Promise<void> {
    const block = this.block(label);
    await block.locator('[data-testid="run-panel"][data-ready]').waitFor();
    await block.getByTestId('run-button').click();
    await block.getByTestId('run-progress').waitFor();
    await block.locator('[data-testid="chart"] svg').first().waitFor({ timeout: timeoutMs });
  }

  /** Wait for the chart of a block. */
  async waitForChart(label: string, version?: number | 'latest'): Promise<void> {
    await this.block(label, version).locator('[data-testid="chart"] svg').first().waitFor();
  }

  /** How many edit links and run buttons the note shows. */
  async controls(): Promise<{ edit: number; run: number }> {
    return { edit: await this.page.getByTestId('edit-note').count(), run: await this.page.getByTestId('run-button').count() };
  }
}
