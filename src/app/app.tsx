import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { Suspense, useEffect, useRef, useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { OfflineBar } from '@/features/offline/components/pending-send-badge';
import { afterRestore } from '@/features/offline/outbox';
import { persistOptions } from '@/features/offline/persist';
import { createQueryClient } from './query-client';
import { createAppRouter } from './router';

type AppRouter = ReturnType<typeof createAppRouter>;

export function App() {
  const [queryClient] = useState(createQueryClient);
  // The router's loaders read the cache as soon as it exists, so it is made once what this phone
  // kept (session, trial, Round, unsent saves) is back in the cache.
  const routerRef = useRef<AppRouter | null>(null);
  const [router, setRouter] = useState<AppRouter | null>(null);
  const [restored, setRestored] = useState(false);
  useEffect(() => {
    if (!restored) return;
    routerRef.current ??= createAppRouter(queryClient);
    setRouter(routerRef.current);
  }, [restored, queryClient]);
  const onRestored = () => {
    afterRestore(queryClient);
    setRestored(true);
  };
  return (
    <PersistQueryClientProvider client={queryClient} persistOptions={persistOptions} onSuccess={onRestored} onError={onRestored}>
      {/* A screen whose strings are not loaded yet waits here (src/i18n: one file per feature and language). */}
      <Suspense fallback={<p className="p-8">…</p>}>
        <OfflineBar />
        {router ? <RouterProvider router={router} /> : <p className="p-8">…</p>}
      </Suspense>
    </PersistQueryClientProvider>
  );
}
