import { lazy, Suspense, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import type { VisualizationSpec } from 'vega-embed';
import { chartConfig } from '@shared/charts/trial-charts';

/** The treatment colours and scale live with the chart specs in shared/, used by server renders too. */
export { treatmentColours, treatmentScale } from '@shared/charts/trial-charts';

const VegaChart = lazy(() => import('./vega-chart'));

/**
 * A chart with its one-line takeaway above it and a text alternative (a table) in a
 * disclosure below, so the numbers are there for screen readers and for copying.
 */
export function Chart({ title, takeaway, spec, fileName, alternative }: { title: string; takeaway: ReactNode; spec: VisualizationSpec; fileName: string; alternative: ReactNode }) {
  const { t, i18n } = useTranslation('charts');
  const lang = i18n.resolvedLanguage === 'es' ? 'es' : 'en';
  return (
    <figure className="space-y-2 rounded-card border border-sand-200 bg-white p-4">
      <figcaption>
        <h3 className="text-base">{title}</h3>
        <p className="text-sm text-ink-muted">{takeaway}</p>
      </figcaption>
      <Suspense
        fallback={
          <p role="status" className="py-8 text-center text-sm text-ink-muted">
            {t(($) => $.drawing)}
          </p>
        }
      >
        <VegaChart
          spec={{ ...spec, config: { ...chartConfig, ...(spec as { config?: object }).config } } as VisualizationSpec}
          fileName={fileName}
          lang={lang}
          label={t(($) => $.imageLabel, { title, takeaway: typeof takeaway === 'string' ? takeaway : '' })}
          words={{ save: t(($) => $.save), saveAs: (format) => t(($) => $.saveAs, { title, format }) }}
        />
      </Suspense>
      <details className="text-sm">
        <summary className="cursor-pointer text-terracotta-700 underline">{t(($) => $.showTable)}</summary>
        <div className="mt-2 overflow-x-auto">{alternative}</div>
      </details>
    </figure>
  );
}
