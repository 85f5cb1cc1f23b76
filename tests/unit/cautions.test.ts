import { describe, expect, test } from 'vitest';
import { CAUTION_IDS, cautionFor, cautionList, cautions, isCautionId, type CautionContext, type CautionId } from '@shared/content/cautions';
import { cautionAnchor, cautionIdsInGuide, cautionsShownInFull, choosingPotsGuide, guides } from '@shared/content/guides';

const languages = ['en', 'es'] as const;

function sentenceCount(text: string): number {
  return text.split(/[.!?](?:\s|$)/).filter((s) => s.trim() !== '').length;
}

function allGuideText(lang: 'en' | 'es'): string[] {
  return guides.flatMap((guide) => [
    guide.title[lang],
    guide.summary[lang],
    ...guide.sections.flatMap((section) => [
      section.heading[lang],
      ...section.blocks.flatMap((block) => {
        if (block.kind === 'paragraph') return [block.text[lang]];
        if (block.kind === 'list') return block.items.map((item) => item[lang]);
        return [];
      }),
    ]),
  ]);
}

describe('caution catalogue', () => {
  test('holds exactly the agreed ids, each keyed by its own id', () => {
    expect(Object.keys(cautions).sort()).toEqual(
      ['greywater', 'twinPotAdhesive', 'kilnFiring', 'frost', 'openPotMosquitoes', 'rootsIntrusion', 'cloggingFertiliser', 'mineralBuildUp'].sort(),
    );
    for (const id of CAUTION_IDS) expect(cautions[id].id).toBe(id);
    expect(cautionList.map((c) => c.id)).toEqual([...CAUTION_IDS]);
  });

  test.each(CAUTION_IDS.flatMap((id) => languages.map((lang) => [id, lang] as const)))('%s has %s title, body and defer-to line', (id, lang) => {
    const caution = cautions[id];
    expect(caution.title[lang].trim()).not.toBe('');
    expect(caution.body[lang].trim()).not.toBe('');
    expect(caution.defersTo[lang].trim()).not.toBe('');
    const sentences = sentenceCount(caution.body[lang]);
    expect(sentences).toBeGreaterThanOrEqual(2);
    expect(sentences).toBeLessThanOrEqual(4);
  });

  test.each(CAUTION_IDS)('%s defers to local rules in both languages', (id) => {
    expect(cautions[id].defersTo.en).toMatch(/local/i);
    expect(cautions[id].defersTo.es).toMatch(/local/i);
  });

  test('Spanish is written, not copied from English', () => {
    for (const caution of cautionList) {
      expect(caution.title.es).not.toBe(caution.title.en);
      expect(caution.body.es).not.toBe(caution.body.en);
      expect(caution.defersTo.es).not.toBe(caution.defersTo.en);
    }
  });

  test('hazards to people are warnings', () => {
    const warnings = cautionList.filter((c) => c.severity === 'warning').map((c) => c.id);
    expect(warnings.sort()).toEqual(['greywater', 'kilnFiring', 'openPotMosquitoes', 'twinPotAdhesive'].sort());
  });

  test('isCautionId accepts catalogue ids only', () => {
    expect(isCautionId('frost')).toBe(true);
    expect(isCautionId('asbestos')).toBe(false);
  });
});

describe('cautionFor', () => {
  test.each<[string, CautionContext, CautionId[]]>([
    ['greywater source', { waterSource: 'greywater' }, ['greywater']],
    ['mains source', { waterSource: 'mains' }, []],
    ['twin-pot build', { potMake: 'twin-pot' }, ['twinPotAdhesive']],
    ['bought pot', { potMake: 'bought' }, []],
    ['cone entered', { firingCone: '04' }, ['kilnFiring']],
    ['firing temperature entered', { firingTemperatureC: 1060 }, ['kilnFiring']],
    ['self-fired flag', { selfFired: true }, ['kilnFiring']],
    ['empty cone field', { firingCone: '  ', firingTemperatureC: null, selfFired: false }, []],
    ['frost at 0 °C', { minTemperatureC: 0 }, ['frost']],
    ['hard frost', { minTemperatureC: -6.5 }, ['frost']],
    ['no frost just above 0 °C', { minTemperatureC: 0.5 }, []],
    ['unknown minimum temperature', { minTemperatureC: null }, []],
    ['no lid', { lid: false }, ['openPotMosquitoes']],
    ['lid on', { lid: true }, []],
    ['lid not stated', {}, []],
    ['fertiliser in the pot', { fertiliserAdded: true }, ['cloggingFertiliser']],
    ['no fertiliser', { fertiliserAdded: false }, []],
  ])('%s', (_label, context, expected) => {
    expect(cautionFor(context)).toEqual(expected);
  });

  test('several triggers give each caution once, in catalogue order', () => {
    expect(
      cautionFor({
        fertiliserAdded: true,
        lid: false,
        minTemperatureC: -2,
        firingCone: '04',
        potMake: 'twin-pot',
        waterSource: 'greywater',
        firingTemperatureC: 1000,
        selfFired: true,
      }),
    ).toEqual(['greywater', 'twinPotAdhesive', 'kilnFiring', 'frost', 'openPotMosquitoes', 'cloggingFertiliser']);
  });
});

describe('guides', () => {
  test('reference only existing caution ids', () => {
    const referenced = guides.flatMap(cautionIdsInGuide);
    expect(referenced.length).toBeGreaterThan(0);
    for (const id of referenced) expect(isCautionId(id)).toBe(true);
  });

  test('show every caution in full exactly once (one anchor per caution)', () => {
    expect([...cautionsShownInFull()].sort()).toEqual([...CAUTION_IDS].sort());
  });

  test('every "see" pointer leads to a caution shown in full', () => {
    const shown = new Set(cautionsShownInFull());
    for (const id of guides.flatMap(cautionIdsInGuide)) expect(shown.has(id)).toBe(true);
  });

  test('anchor ids are unique across guides, sections and cautions', () => {
    const anchors = [...guides.map((g) => g.id), ...guides.flatMap((g) => g.sections.map((s) => s.id)), ...CAUTION_IDS.map(cautionAnchor)];
    expect(new Set(anchors).size).toBe(anchors.length);
    for (const anchor of anchors) expect(anchor).toMatch(/^[a-z][a-z0-9-]*$/);
  });

  test('every text exists in both languages', () => {
    const en = allGuideText('en');
    const es = allGuideText('es');
    expect(es).toHaveLength(en.length);
    for (const text of [...en, ...es]) expect(text.trim()).not.toBe('');
  });

  test('the wetted-zone guidance is marked as a rule of thumb', () => {
    // Wetted zone ≈ one pot radius beyond the wall: common practice, no source (REFERENCES.md).
    const spacing = choosingPotsGuide.sections.find((s) => s.id === 'pots-spacing');
    expect(spacing).toBeDefined();
    const wetted = spacing!.blocks.flatMap((b) => (b.kind === 'paragraph' ? [b.text] : [])).find((text) => /one pot radius/i.test(text.en));
    expect(wetted?.en).toMatch(/rule of thumb/i);
    expect(wetted?.es).toMatch(/regla práctica/i);
  });

  test('no single saving figure is promised', () => {
    // Reported savings range from about 50% (common practice) to 70% (Daka & Nonde 1996) and
    // 82-84% (Siyal, Soomro & Siyal 2015): REFERENCES.md.
    const text = allGuideText('en').join('\n');
    expect(text).toMatch(/70-84%/);
    expect(text).not.toMatch(/\b(will|always) save\b/i);
  });
});
