import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';

export function NotFoundPage() {
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1>Page not found</h1>
      <p className="mt-2 text-ink-muted">That address does not lead anywhere in Seepwise.</p>
      <Link className="mt-4 inline-block text-terracotta-700 underline" to={paths.home}>
        Go home
      </Link>
    </main>
  );
}
