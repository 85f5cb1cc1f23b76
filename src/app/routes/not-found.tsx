import { useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';

export function NotFoundPage() {
  const { t } = useTranslation();
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1>{t(($) => $.notFound.title)}</h1>
      <p className="mt-2 text-ink-muted">{t(($) => $.notFound.body)}</p>
      <Link className="mt-4 inline-block text-terracotta-700 underline" to={paths.home}>
        {t(($) => $.notFound.home)}
      </Link>
    </main>
  );
}
