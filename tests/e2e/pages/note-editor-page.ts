// Page object of the figure-note editor (/m/<slug>/notes/<note>/edit) for the browser tests: the MDX source, the
// live preview, the problems list, the figure-block picker, saving and the revision diff.
import type { Page } from 'playwright-core';

export class NoteEditorPage {
  constructor(readonly page: Page) {}

  async open(manuscriptSlug: string, noteSlug: string): Promise<void> {
    await this.page.goto(`/m/${manuscriptSlug}/notes/${noteSlug}/edit`);
  }

  /** Wait until the live preview shows typeset math. */
  async waitForMathInPreview(): Promise<void> {
    await this.page.getByTestId('note-preview').locator('.katex').first().waitFor();
  }

  async writeSource(source: string): Promise<void> {
    await this.page.getByTestId('note-source').fill(source);
  }

  async source(): Promise<string> {
    return this.page.getByTestId('note-source').inputValue();
  }

  /** The problems list under the editor ('' while it is not shown). */
  async problems(): Promise<string> {
    const list = this.page.getByTestId('note-problems');
    return (await list.count()) > 0 ? ((await list.textContent()) ?? '') : '';
  }

  async waitForNoProblems(): Promise<void> {
    await this.page.getByTestId('note-problems').waitFor({ state: 'detached' });
  }

  /** Insert a figure block with the picker and wait for its preview. */
  async insertFigure(label: string): Promise<void> {
    await this.page.getByTestId('picker-figure').selectOption(label);
    await this.page.getByTestId('insert-figure').click();
    await this.page.getByTestId('note-preview').locator(`[data-figure-preview="${label}"]`).waitFor();
  }

  async save(): Promise<void> {
    await this.page.getByTestId('save-note').click();
  }

  async saveStatus(): Promise<string> {
    return (await this.page.getByTestId('save-status').textContent()) ?? '';
  }

  /** The diff of the latest revision against the one before. */
  async revisionDiff(): Promise<string> {
    const diff = this.page.getByTestId('revision-diff');
    await diff.waitFor();
    return (await diff.textContent()) ?? '';
  }
}
