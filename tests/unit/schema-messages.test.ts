/**
 * The shared schemas' English messages that forms translate by their text (src/lib/schema-messages):
 * each listed text must still be one the shared schemas say (a reworded rule would silently fall
 * back to English), and its English translation must be that very text.
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { schemaMessageKeys as gardens } from '@/features/gardens/components/schema-message-keys';
import { schemaMessageKeys as logs } from '@/features/logs/components/schema-message-keys';
import { schemaMessageKeys as pots } from '@/features/pots/components/schema-message-keys';
import { schemaMessageKeys as trials } from '@/features/trials/components/schema-message-keys';

const dir = path.resolve(__dirname, '../../shared/schemas');
const sharedSource = fs
  .readdirSync(dir)
  .filter((f) => f.endsWith('.ts'))
  .map((f) => fs.readFileSync(path.join(dir, f), 'utf8'))
  .join('\n');

describe.each([
  ['gardens', gardens],
  ['trials', trials],
  ['logs', logs],
  ['pots', pots],
] as const)('%s', (ns, keys) => {
  const en = JSON.parse(fs.readFileSync(path.resolve(__dirname, `../../src/locales/en/${ns}.json`), 'utf8')).schema as Record<string, string>;
  it('lists messages the shared schemas really say', () => {
    for (const text of Object.keys(keys)) expect(sharedSource, text).toContain(text);
  });
  it('keeps the English words identical to the schema', () => {
    for (const [text, key] of Object.entries(keys)) expect(en[key], key).toBe(text);
    expect(Object.keys(en).sort()).toEqual([...new Set(Object.values(keys))].sort());
  });
});
