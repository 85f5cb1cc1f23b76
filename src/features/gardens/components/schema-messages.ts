import { useTranslation } from 'react-i18next';
import { schemaMessage } from '@/lib/schema-messages';
import { schemaMessageKeys } from './schema-message-keys';

/** Translates a shared-schema message (client zod or server field error) into the reader's language. */
export function useGardenMessages() {
  const { t } = useTranslation('gardens');
  return schemaMessage(schemaMessageKeys, (k) => t(($) => $.schema[k]));
}
