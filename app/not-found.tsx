// 404 page: the same words for a page that does not exist and a manuscript the visitor may not see.
// Next renders it for unknown routes and for every notFound() call.
import { ButtonLink } from './_components/button';

export default function NotFound() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <p className="text-sm font-semibold tracking-wide text-phase-700 uppercase">404</p>
      <h1 className="mt-2 text-2xl font-semibold text-slate-900">Nothing here</h1>
      <p className="mt-3 text-slate-600">
        This page does not exist, or it belongs to a manuscript you are not a member of. If someone shared a link with
        you, ask them to invite your e-mail address.
      </p>
      <ButtonLink href="/dashboard" className="mt-8">
        Go to my manuscripts
      </ButtonLink>
    </div>
  );
}
