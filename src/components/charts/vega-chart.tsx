import { VegaEmbed } from 'react-vega';
import type { VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';

/**
 * The only module that imports vega: loaded lazily so the first page does not carry it. The
 * interpreter keeps vega's expressions working under our content security policy (no eval).
 */
export default function VegaChart({ spec, fileName }: { spec: VisualizationSpec; fileName: string }) {
  return (
    <VegaEmbed
      spec={spec}
      options={{
        ast: true,
        expr: expressionInterpreter,
        renderer: 'svg',
        downloadFileName: fileName,
        actions: { export: true, source: false, compiled: false, editor: false },
      }}
    />
  );
}
