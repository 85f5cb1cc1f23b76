import { lazy, Suspense, type ReactNode } from 'react';
import type { VisualizationSpec } from 'vega-embed';

const VegaChart = lazy(() => import('./vega-chart'));

/** Seepwise's two treatment colours, the same in every chart (always with a legend or label too). */
export const treatmentColours = { olla: '#4a7642', surface: '#3b5f8a' } as const;

export function treatmentScale(treatments: string[]) {
  const extra = ['#b5562f', '#8a6f48', '#7c3820', '#5d83ae'];
  let i = 0;
  return {
    domain: treatments,
    range: treatments.map((t) => (t in treatmentColours ? treatmentColours[t as keyof typeof treatmentColours] : (extra[i++ % extra.length] as string))),
  };
}

/** Base config: Plex Sans, calm axes, our ink colours. */
export const chartConfig = {
  font: 'IBM Plex Sans',
  background: '#ffffff',
  axis: { labelColor: '#2b241d', titleColor: '#2b241d', gridColor: '#ede1cd', domainColor: '#8a7d6e', tickColor: '#8a7d6e', labelFontSize: 12, titleFontSize: 12 },
  legend: { labelColor: '#2b241d', titleColor: '#2b241d', labelFontSize: 12, titleFontSize: 12 },
  view: { stroke: null },
} as const;

/**
 * A chart with its one-line takeaway above it and a text alternative (a table) in a
 * disclosure below, so the numbers are there for screen readers and for copying.
 */
export function Chart({ title, takeaway, spec, fileName, alternative }: { title: string; takeaway: ReactNode; spec: VisualizationSpec; fileName: string; alternative: ReactNode }) {
  return (
    <figure className="space-y-2 rounded-card border border-sand-200 bg-white p-4">
      <figcaption>
        <h3 className="text-base">{title}</h3>
        <p className="text-sm text-ink-muted">{takeaway}</p>
      </figcaption>
      <div className="overflow-x-auto" role="img" aria-label={`${title}. ${typeof takeaway === 'string' ? takeaway : ''} The same numbers are in the table below.`}>
        <Suspense fallback={<p role="status" className="py-8 text-center text-sm text-ink-muted">Drawing the chart…</p>}>
          <VegaChart spec={{ ...spec, config: { ...chartConfig, ...(spec as { config?: object }).config } } as VisualizationSpec} fileName={fileName} />
        </Suspense>
      </div>
      <details className="text-sm">
        <summary className="cursor-pointer text-terracotta-700 underline">Show the numbers as a table</summary>
        <div className="mt-2 overflow-x-auto">{alternative}</div>
      </details>
    </figure>
  );
}
