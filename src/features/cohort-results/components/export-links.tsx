import { useTranslation } from 'react-i18next';
const files = ['plots', 'water-events', 'moisture-readings', 'harvests', 'weather-days', 'data-dictionary'] as const;

/** Download links for every cohort CSV: pseudonymised, the same data the pooled results use. */
export function ExportLinks({ cohortId }: { cohortId: string }) {
  const { t } = useTranslation('cohortResults');
  return (
    <div className="space-y-3">
      <p className="max-w-3xl text-sm text-ink-muted">
        {t(($) => $.exports.intro)} {t(($) => $.exports.language)}
      </p>
      <a
        className="inline-flex min-h-11 items-center rounded-lg bg-terracotta-600 px-4 font-medium text-white hover:bg-terracotta-700"
        href={`/api/cohorts/${encodeURIComponent(cohortId)}/report.zip`}
        download
      >
        {t(($) => $.exports.bundle)}
      </a>
      <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
        {files.map((f) => (
          <li key={f} className="rounded-lg border border-sand-200 bg-white p-3">
            <a
              className="inline-flex min-h-10 items-center font-medium text-terracotta-700 underline"
              href={`/api/cohorts/${encodeURIComponent(cohortId)}/export/${f}.csv`}
              download
            >
              {f}.csv
            </a>
            <p className="text-sm text-ink-muted">{t(($) => $.exports.files[f])}</p>
          </li>
        ))}
      </ul>
    </div>
  );
}
