// The root address: the dashboard when signed in, otherwise the sign-in page.
import { redirect } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/session';

export default async function HomePage() {
  redirect((await getCurrentUser()) ? '/dashboard' : '/sign-in');
}
