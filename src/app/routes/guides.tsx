import { GuidesPage } from '@/features/guides/components/guides-page';

/** The guides in the screen's language (the account's setting once signed in, see src/i18n). */
export function GuidesRoute() {
  return <GuidesPage />;
}
