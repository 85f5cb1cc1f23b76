import { useCurrentUser } from '@/features/auth/api/get-session';
import { GuidesPage } from '@/features/guides/components/guides-page';

export function GuidesRoute() {
  const user = useCurrentUser();
  return <GuidesPage lang={user?.language ?? 'en'} />;
}
