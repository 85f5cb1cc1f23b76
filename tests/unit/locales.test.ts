/**
 * The translation files (src/locales/<lang>/<namespace>.json, loaded by src/i18n, and
 * shared/locales/<lang>/<namespace>.json, read by shared/i18n/translate.ts for charts, reports and
 * export dictionaries on both client and server): Spanish must
 * carry every English string and nothing else, with the same {{placeholders}}, and the plural forms
 * each language needs. The plural categories are read from the platform's own CLDR data
 * (Intl.PluralRules, the same rules i18next uses), not from a list of ours: English has "one" and
 * "other"; Spanish also has "many" (CLDR 42 onwards, e.g. "1 millón de …").
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOTS = { src: path.resolve(__dirname, '../../src/locales'), shared: path.resolve(__dirname, '../../shared/locales') };
const LANGS = ['en', 'es'] as const;
const PLURAL = /_(zero|one|two|few|many|other)$/;

type Tree = { [k: string]: string | Tree };

function flatten(tree: Tree, prefix = ''): Map<string, string> {
  const out = new Map<string, string>();
  for (const [k, v] of Object.entries(tree)) {
    const key = prefix ? `${prefix}.${k}` : k;
    if (typeof v === 'string') out.set(key, v);
    else for (const [kk, vv] of flatten(v, key)) out.set(kk, vv);
  }
  return out;
}

const placeholders = (s: string) => [...s.matchAll(/\{\{\s*([\w.]+)(?:\s*,[^}]*)?\s*\}\}/g)].map((m) => m[1]!).sort();
/** Keys with the plural suffix taken off, so "pots_one"/"pots_other" count as "pots". */
const bases = (keys: Iterable<string>) => new Set([...keys].map((k) => k.replace(PLURAL, '')));

describe.each(Object.entries(ROOTS))('translation files in %s/locales', (root, ROOT) => {
  const read = (lang: string, file: string) => flatten(JSON.parse(fs.readFileSync(path.join(ROOT, lang, file), 'utf8')) as Tree);
  const namespaces = fs.readdirSync(path.join(ROOT, 'en')).filter((f) => f.endsWith('.json'));

  it('has the same namespaces in every language', () => {
    for (const lang of LANGS) expect(fs.readdirSync(path.join(ROOT, lang)).filter((f) => f.endsWith('.json')).sort()).toEqual([...namespaces].sort());
    expect(namespaces).toContain(root === 'src' ? 'common.json' : 'charts.json');
  });

  it('reads the plural categories from CLDR (Intl.PluralRules)', () => {
    expect(new Intl.PluralRules('en').resolvedOptions().pluralCategories.sort()).toEqual(['one', 'other']);
    expect(new Intl.PluralRules('es').resolvedOptions().pluralCategories).toEqual(expect.arrayContaining(['one', 'other']));
  });

  describe.each(namespaces)('%s', (file) => {
    const en = read('en', file);
    const es = read('es', file);

    it('Spanish has every English string and no other', () => {
      expect([...bases(es.keys())].sort()).toEqual([...bases(en.keys())].sort());
    });

    it('every string is filled in', () => {
      for (const [lang, strings] of [['en', en], ['es', es]] as const) {
        for (const [k, v] of strings) expect(v.trim(), `${lang}:${k}`).not.toBe('');
      }
    });

    it('a plural has every form its language needs', () => {
      for (const [lang, strings] of [['en', en], ['es', es]] as const) {
        const needed = new Intl.PluralRules(lang).resolvedOptions().pluralCategories;
        const plurals = new Set([...strings.keys()].filter((k) => PLURAL.test(k)).map((k) => k.replace(PLURAL, '')));
        for (const base of plurals) for (const c of needed) expect(strings.has(`${base}_${c}`), `${lang}:${base}_${c}`).toBe(true);
      }
    });

    it('keeps the same {{placeholders}} in both languages', () => {
      const byBase = (strings: Map<string, string>) => {
        const m = new Map<string, Set<string>>();
        for (const [k, v] of strings) {
          const b = k.replace(PLURAL, '');
          const set = m.get(b) ?? new Set<string>();
          for (const p of placeholders(v)) if (p) set.add(p);
          m.set(b, set);
        }
        return m;
      };
      const a = byBase(en);
      const b = byBase(es);
      // "count" may be left out of a form that does not show the number ("one" → "a pot").
      const norm = (s: Set<string> | undefined) => [...(s ?? [])].filter((p) => p !== 'count').sort();
      for (const [k, set] of a) expect(norm(b.get(k)), `${file}:${k}`).toEqual(norm(set));
    });
  });
});
