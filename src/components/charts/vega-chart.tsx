import { useEffect, useRef, useState } from 'react';
import { VegaEmbed } from 'react-vega';
import type { Result, VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';

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
 */
export default function VegaChart({ spec, fileName, label, title }: { spec: VisualizationSpec; fileName: string; label: string; title: string }) {
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
          spec={spec}
          onEmbed={(result) => setView(result.view)}
          options={{
            ast: true,
            expr: expressionInterpreter,
            renderer: 'svg',
            actions: false,
          }}
        />
      </div>
      {view ? (
        <p className="flex flex-wrap items-center gap-2 text-sm text-ink-muted">
          Save the chart:
          {(['svg', 'png'] as const).map((ext) => (
            <button
              key={ext}
              type="button"
              className="min-h-10 rounded-lg border border-sand-300 bg-white px-3 font-medium text-ink hover:bg-sand-100"
              aria-label={`Save “${title}” as ${ext.toUpperCase()}`}
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
