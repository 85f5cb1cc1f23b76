import { Fragment, type ReactNode } from 'react';

/** Stands in for an element inside a translated sentence: `t(key, { code: SLOT })`, then `fillSlots(text, [<b>…</b>])`. */
export const SLOT = '\u241f';

/**
 * A translated sentence with elements where it had `SLOT`s, in order: the words around them stay
 * whole in each language (no sentence cut into separately translated pieces).
 */
export function fillSlots(text: string, nodes: ReactNode[]): ReactNode {
  const parts = text.split(SLOT);
  return parts.map((part, i) => (
    <Fragment key={i}>
      {part}
      {i < parts.length - 1 ? nodes[i] : null}
    </Fragment>
  ));
}
