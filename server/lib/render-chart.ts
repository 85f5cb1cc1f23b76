import { Resvg } from '@resvg/resvg-js';
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import type { Lang } from '@shared/i18n/translate';
import { vegaLocale } from '@shared/charts/vega-locale';

/**
 * Renders a Vega-Lite spec to SVG (vega's own SVG renderer, no browser) and the SVG to PNG with
 * resvg (a Rust renderer shipped as a prebuilt npm binary). Text uses the machine's fonts; IBM
 * Plex Sans falls back to DejaVu or Liberation Sans, which Debian installs with Chromium.
 */
export async function renderChart(spec: Record<string, unknown>, opts: { scale?: number; lang?: Lang } = {}): Promise<{ svg: string; png: Buffer }> {
  const vgSpec = compile(spec as unknown as TopLevelSpec).spec;
  // Axis numbers and dates in the reader's language (decimal comma in Spanish).
  const view = new vega.View(vega.parse(vgSpec), { renderer: 'none', locale: vegaLocale(opts.lang ?? 'en') } as unknown as vega.ViewOptions);
  const svg = await view.toSVG(opts.scale ?? 1);
  view.finalize();
  const png = new Resvg(svg, {
    background: '#ffffff',
    fitTo: { mode: 'zoom', value: 2 },
    font: { loadSystemFonts: true, defaultFontFamily: 'DejaVu Sans', sansSerifFamily: 'DejaVu Sans' },
  })
    .render()
    .asPng();
  return { svg, png };
}
