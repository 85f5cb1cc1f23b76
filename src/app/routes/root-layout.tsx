import { useTranslation } from 'react-i18next';
import { Outlet, useNavigation } from 'react-router-dom';

/**
 * Every page sits under this. While the next page's code or data loads (lazy routes and loaders in
 * src/app/router.tsx), the current page stays up and a thin bar runs along the top, announced once
 * to screen readers.
 */
export function RootLayout() {
  const { t } = useTranslation();
  const loading = useNavigation().state === 'loading';
  return (
    <>
      {loading ? (
        <div role="status" className="fixed inset-x-0 top-0 z-50 h-1 overflow-hidden bg-sand-100">
          <div className="h-full w-1/3 animate-[seepwise-pending_1.2s_ease-in-out_infinite] bg-terracotta-600 motion-reduce:w-full motion-reduce:animate-none" />
          <span className="sr-only">{t(($) => $.loading)}</span>
        </div>
      ) : null}
      <Outlet />
    </>
  );
}
