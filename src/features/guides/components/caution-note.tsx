/** The caution callout is shared UI (src/components/ui) so every feature can show it; kept here for the guides. */
export { CautionList, CautionNote } from '@/components/ui/caution-note';
