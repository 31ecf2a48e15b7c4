// POST /api/notes/preview: the editor's live preview. Runs the safe-MDX gate; a refused note answers 400 with the
// problems and their lines, a safe one answers { html } rendered with the preview components (static figure cards).
import path from 'node:path';
import { createElement, type ReactElement } from 'react';
import { previewNoteComponents } from '@/app/_components/notes/note-components';
import { loadNoteFigures } from '@/app/_components/notes/load-note-figures';
import { authorizeManuscript } from '@/lib/authz/manuscript-access';
import { route } from '@/lib/http/handler';
import { checkNoteSource } from '@/lib/mdx/check-note';
import { renderableNote } from '@/lib/mdx/compile-note';
import { unsafeNoteResponse } from '@/lib/http/unsafe-note-response';
import { notePreviewSchema } from './schema';

export const runtime = 'nodejs';

/**
 * react-dom/server, loaded at run time: Next refuses a static import of it in App Router files, but the preview must
 * be an HTML string (the editor shows it beside the source). The preview components are plain, hook-free functions.
 */
function renderToStaticMarkup(element: ReactElement): string {
  // Resolved by Node from the project's node_modules, out of the bundler's sight (process.getBuiltinModule, Node >= 20.16).
  const { createRequire } = process.getBuiltinModule('node:module') as typeof import('node:module');
  const load = createRequire(path.join(process.cwd(), 'package.json'));
  const server = load('react-dom/server') as { renderToStaticMarkup: (node: ReactElement) => string };
  return server.renderToStaticMarkup(element);
}
export const dynamic = 'force-dynamic';

export const POST = route({ body: notePreviewSchema }, async ({ body, user }) => {
  const { manuscript } = await authorizeManuscript({ user, manuscriptId: body.manuscriptId, need: 'edit' });
  const check = await checkNoteSource(body.source);
  if (!check.ok) return unsafeNoteResponse(check.errors);
  const data = await loadNoteFigures({ manuscriptId: manuscript.id, manuscriptSlug: manuscript.slug, source: body.source });
  const { Content } = await renderableNote(body.source);
  const html = renderToStaticMarkup(createElement(Content, { components: previewNoteComponents(data) }));
  return {
    html,
    warnings: check.warnings,
    figures: Object.values(data.figures).map((f) => ({ label: f.figure.label, kind: f.figure.kind, versions: f.snapshots.map((s) => s.version) })),
  };
});
