import type { ReactNode } from 'react';
import type { CautionId } from '@shared/content/cautions';

/** One of the grower's trials, as a source of a measured spread. */
export interface PlannerTrial {
  id: string;
  title: string;
  closed: boolean;
}

/** A pot from the grower's shelf, to fill the refill sums with its own numbers. */
export interface PlannerPot {
  id: string;
  label: string;
  capacityL: number;
  widestDiameterCm: number;
  latestSeepLitresPerDay: number | null;
}

/** Renders one caution of the shared catalogue (the route supplies the Guides' caution note). */
export type RenderCaution = (id: CautionId, options?: { headingLevel?: 3 | 4 | 5 }) => ReactNode;
