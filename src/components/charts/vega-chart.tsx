import { useEffect, useRef, useState } from 'react';
import { VegaEmbed } from 'react-vega';
import type { Result, VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';
import { vegaLocale } from '@shared/charts/vega-locale';
import type { Lang } from '@shared/i18n/translate';

type View = Result['view'];

/** Saves the drawn chart as a file, as the chart's own menu did (SVG as drawn, PNG at twice the size). */
async function saveChart(view: View, ext: 'svg' | 'png', fileName: string) {
  const link = document.createElement('a');
  link.href = await view.toImageURL(ext, ext === 'png' ? 2 : 1);
  link.download = `${fileName}.${ext}`;
  link.click();
}

/**
 * The only module that imports vega: loaded lazily so the first page does not carry it. The
 * interpreter keeps vega's expressions working under our content security policy (no eval).
 *
 * The drawing is one image to assistive technology (role="img", named by `label`; the numbers are
 * in the table beside it). The save buttons are ours, outside the image: vega-embed's own menu put
 * an unnamed disclosure and links inside the image, where they cannot be reached or announced.
 * Axis numbers and dates follow the reader's language (decimal comma in Spanish); the caller
 * passes the translated words of the save buttons.
 */
export default function VegaChart({
  spec,
  fileName,
  label,
  lang,
  words,
}: {
  spec: VisualizationSpec;
  fileName: string;
  label: string;
  lang: Lang;
  words: { save: string; saveAs: (format: string) => string };
}) {
  const locale = vegaLocale(lang);
  const [view, setView] = useState<View | null>(null);
  // A chart wider than a phone scrolls sideways; then the keyboard must be able to reach it to scroll it.
  const box = useRef<HTMLDivElement>(null);
  const [scrolls, setScrolls] = useState(false);
  useEffect(() => {
    const el = box.current;
    if (!el || !view) return;
    const check = () => setScrolls(el.scrollWidth > el.clientWidth + 1);
    check();
    const observer = new ResizeObserver(check);
    observer.observe(el);
    const svg = el.querySelector('svg');
    if (svg) observer.observe(svg);
    return () => observer.disconnect();
  }, [view]);
  return (
    <>
      <div ref={box} className="overflow-x-auto" role="img" aria-label={label} tabIndex={scrolls ? 0 : undefined}>
        <VegaEmbed
          // A new language builds a new view: vega reads its locale once.
          key={lang}
          spec={spec}
          onEmbed={(result) => setView(result.view)}
          options={{
            ast: true,
            expr: expressionInterpreter,
            renderer: 'svg',
            formatLocale: locale.number as unknown as Record<string, unknown>,
            timeFormatLocale: locale.time as unknown as Record<string, unknown>,
            actions: false,
          }}
        />
      </div>
      {view ? (
        <p className="flex flex-wrap items-center gap-2 text-sm text-ink-muted">
          {words.save}
          {(['svg', 'png'] as const).map((ext) => (
            <button
              key={ext}
              type="button"
              className="min-h-10 rounded-lg border border-sand-300 bg-white px-3 font-medium text-ink hover:bg-sand-100"
              aria-label={words.saveAs(ext.toUpperCase())}
              onClick={() => void saveChart(view, ext, fileName)}
            >
              {ext.toUpperCase()}
            </button>
          ))}
        </p>
      ) : null}
    </>
  );
}
