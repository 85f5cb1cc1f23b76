import { VegaEmbed } from 'react-vega';
import type { VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';
import { vegaLocale } from '@shared/charts/vega-locale';
import type { Lang } from '@shared/i18n/translate';

/**
 * The only module that imports vega: loaded lazily so the first page does not carry it. The
 * interpreter keeps vega's expressions working under our content security policy (no eval).
 * Axis numbers and dates follow the reader's language (decimal comma in Spanish), and the save
 * menu is in it too.
 */
export default function VegaChart({ spec, fileName, lang, labels }: { spec: VisualizationSpec; fileName: string; lang: Lang; labels: { menu: string; svg: string; png: string } }) {
  const locale = vegaLocale(lang);
  return (
    <VegaEmbed
      // A new language builds a new view: vega reads its locale once.
      key={lang}
      spec={spec}
      options={{
        ast: true,
        expr: expressionInterpreter,
        renderer: 'svg',
        downloadFileName: fileName,
        formatLocale: locale.number as unknown as Record<string, unknown>,
        timeFormatLocale: locale.time as unknown as Record<string, unknown>,
        i18n: { CLICK_TO_VIEW_ACTIONS: labels.menu, SVG_ACTION: labels.svg, PNG_ACTION: labels.png, COMPILED_ACTION: '', EDITOR_ACTION: '', SOURCE_ACTION: '' },
        actions: { export: true, source: false, compiled: false, editor: false },
      }}
    />
  );
}
