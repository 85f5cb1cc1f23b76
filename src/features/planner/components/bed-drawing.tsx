import { useId } from 'react';
import { useTranslation } from 'react-i18next';
import type { Bed, OllaPlan } from '@shared/agronomy/olla-layout';
import { useUnits } from '@/lib/units';

const SAGE = '#4a7642';
/** More pots than this are listed in words only: a drawing of hundreds of dots helps nobody. */
export const MAX_DRAWN_POTS = 400;

/** A bed seen from above: the bed, each pot, and each pot's wetted zone (dashed, by the rule of thumb). */
export function BedDrawing({ bed, plan, potDiameterM, description }: { bed: Bed; plan: OllaPlan; potDiameterM: number; description: string }) {
  const units = useUnits();
  const { t } = useTranslation('planner');
  const id = useId();
  const L = bed.lengthM;
  const W = bed.widthM;
  const big = Math.max(L, W);
  const pad = big * 0.09;
  const font = big * 0.055;
  const viewBox = `${-pad * 1.4} ${-pad * 1.4} ${L + pad * 2.4} ${W + pad * 2.4}`;
  const lengthText = units.fmt(L, 'length', 2);
  const widthText = units.fmt(W, 'length', 2);
  return (
    <figure className="space-y-2">
      <svg viewBox={viewBox} role="img" aria-labelledby={`${id}-title ${id}-desc`} className="mx-auto block max-h-[26rem] w-full" preserveAspectRatio="xMidYMid meet">
        <title id={`${id}-title`}>{t(($) => $.bed.drawingTitle)}</title>
        <desc id={`${id}-desc`}>{description}</desc>
        <defs>
          <clipPath id={`${id}-bed`}>
            <rect x={0} y={0} width={L} height={W} />
          </clipPath>
        </defs>
        <rect x={0} y={0} width={L} height={W} fill="#f6efe4" stroke="#8a7d6e" strokeWidth={1.5} vectorEffect="non-scaling-stroke" />
        <g clipPath={`url(#${id}-bed)`}>
          {plan.positions.map((p, i) => (
            <circle
              key={`w${i}`}
              cx={p.x}
              cy={p.y}
              r={plan.wettedRadiusM}
              fill={SAGE}
              fillOpacity={0.1}
              stroke={SAGE}
              strokeWidth={1.5}
              strokeDasharray="5 4"
              vectorEffect="non-scaling-stroke"
            />
          ))}
        </g>
        {plan.positions.map((p, i) => (
          <circle key={`p${i}`} cx={p.x} cy={p.y} r={potDiameterM / 2} fill={SAGE} stroke="#ffffff" strokeWidth={1} vectorEffect="non-scaling-stroke" />
        ))}
        <text x={L / 2} y={-pad * 0.45} fontSize={font} textAnchor="middle" fill="#2b241d" fontFamily="IBM Plex Sans, sans-serif">
          {lengthText}
        </text>
        <text
          x={-pad * 0.45}
          y={W / 2}
          fontSize={font}
          textAnchor="middle"
          fill="#2b241d"
          fontFamily="IBM Plex Sans, sans-serif"
          transform={`rotate(-90 ${-pad * 0.45} ${W / 2})`}
        >
          {widthText}
        </text>
      </svg>
      <figcaption className="flex flex-wrap justify-center gap-x-5 gap-y-1 text-sm text-ink-muted">
        <span className="inline-flex items-center gap-2">
          <svg aria-hidden="true" viewBox="0 0 16 16" className="size-4">
            <circle cx="8" cy="8" r="6" fill={SAGE} />
          </svg>
          {t(($) => $.bed.legendPot)}
        </span>
        <span className="inline-flex items-center gap-2">
          <svg aria-hidden="true" viewBox="0 0 16 16" className="size-4">
            <circle cx="8" cy="8" r="6.5" fill={SAGE} fillOpacity={0.1} stroke={SAGE} strokeWidth={1.5} strokeDasharray="3 2" />
          </svg>
          {t(($) => $.bed.legendWetted)}
        </span>
        <span>{t(($) => $.bed.legendScale)}</span>
      </figcaption>
    </figure>
  );
}
