import type { ReactNode } from 'react';
import type { CautionId } from '@shared/content/cautions';

/** One of the grower's own plots a pot can sit in (the route gathers them from the trials). */
export interface PlotChoice {
  id: string;
  label: string;
  trialId: string;
  trialTitle: string;
  trialClosed: boolean;
  /** 'olla', 'surface', another treatment, or null before the draw. */
  treatment: string | null;
  /** Whether the plot's pots are kept covered. */
  lid: boolean;
}

/** Renders one caution of the shared catalogue (the route supplies the Guides' caution note). */
export type RenderCaution = (id: CautionId, options?: { headingLevel?: 3 | 4 | 5; anchorId?: string }) => ReactNode;
