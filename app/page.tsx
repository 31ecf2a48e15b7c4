// The root address: the dashboard when signed in, otherwise the sign-in page.
// A redirect only; the pages themselves check the session again.
import { redirect } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/session';

export default async function HomePage() {
  redirect((await getCurrentUser()) ? '/dashboard' : '/sign-in');
}
