/**
 * Validation messages of the shared schemas (shared/schemas/*) reach a form in English twice over:
 * from zod on the client and as the server's field errors, which come from the very same schema.
 * A feature translates them by looking the English text up in its namespace's `schema` group;
 * an unknown message (a new rule, a server-only one) is shown as it came.
 */
export function schemaMessage<K extends string>(keys: Readonly<Record<string, K>>, words: (key: K) => string) {
  return (message: string | undefined): string | undefined => {
    if (!message) return message;
    const key = keys[message];
    return key ? words(key) : message;
  };
}
