import { useTranslation } from 'react-i18next';
import { cautions, type Language } from '@shared/content/cautions';
import { cautionAnchor, guides, type GuideBlock } from '@shared/content/guides';
import { CautionNote } from './caution-note';

const TOC_ID = 'guides-contents';
const linkClass = 'text-terracotta-700 underline underline-offset-2 hover:text-terracotta-800';

function Block({ block, lang }: { block: GuideBlock; lang: Language }) {
  const { t } = useTranslation('guides', { lng: lang });
  switch (block.kind) {
    case 'paragraph':
      return <p>{block.text[lang]}</p>;
    case 'list': {
      const items = block.items.map((item) => <li key={item.en}>{item[lang]}</li>);
      // role="list" keeps list semantics in Safari once Tailwind removes the markers.
      return block.style === 'steps' ? (
        <ol role="list" className="list-decimal space-y-1 pl-6">
          {items}
        </ol>
      ) : (
        <ul role="list" className="list-disc space-y-1 pl-6">
          {items}
        </ul>
      );
    }
    case 'caution':
      return <CautionNote id={block.cautionId} lang={lang} headingLevel={4} anchorId={cautionAnchor(block.cautionId)} />;
    case 'seeCautions':
      return (
        <p className="text-sm text-ink-muted">
          {t(($) => $.seeAlso)}{' '}
          {block.cautionIds.map((id, index) => (
            <span key={id}>
              {index > 0 && ', '}
              <a className={linkClass} href={`#${cautionAnchor(id)}`}>
                {cautions[id].title[lang]}
              </a>
            </span>
          ))}
          .
        </p>
      );
  }
}

export interface GuidesPageProps {
  /** Defaults to the screen's language (src/i18n); the guides' own texts are in shared/content. */
  lang?: Language;
}

/** The Guides: fair trials; choosing, placing and caring for pots; cautions. */
export function GuidesPage({ lang: langProp }: GuidesPageProps) {
  const { i18n } = useTranslation();
  const lang: Language = langProp ?? (i18n.resolvedLanguage === 'es' ? 'es' : 'en');
  const { t } = useTranslation('guides', { lng: lang });
  return (
    <article lang={lang} aria-labelledby="guides-title" className="mx-auto max-w-prose space-y-10 pb-16 leading-relaxed">
      <header>
        <h1 id="guides-title">{t(($) => $.title)}</h1>
        <p className="mt-2 text-ink-muted">{t(($) => $.intro)}</p>
      </header>

      <nav aria-labelledby={TOC_ID} className="rounded-card border border-sand-200 bg-white p-5 shadow-sm">
        <h2 id={TOC_ID} className="scroll-mt-6 text-base">
          {t(($) => $.contents)}
        </h2>
        <ol role="list" className="mt-3 space-y-3">
          {guides.map((guide) => (
            <li key={guide.id}>
              <a className={`${linkClass} font-medium`} href={`#${guide.id}`}>
                {guide.title[lang]}
              </a>
              <ol role="list" className="mt-1 space-y-1 border-l border-sand-200 pl-4 text-sm">
                {guide.sections.map((section) => (
                  <li key={section.id}>
                    <a className={linkClass} href={`#${section.id}`}>
                      {section.heading[lang]}
                    </a>
                  </li>
                ))}
              </ol>
            </li>
          ))}
        </ol>
      </nav>

      {guides.map((guide) => (
        <section key={guide.id} aria-labelledby={guide.id} className="space-y-6">
          <header className="border-b border-sand-200 pb-3">
            <h2 id={guide.id} className="scroll-mt-6">
              {guide.title[lang]}
            </h2>
            <p className="mt-1 text-ink-muted">{guide.summary[lang]}</p>
          </header>
          {guide.sections.map((section) => (
            <section key={section.id} className="space-y-3">
              <h3 id={section.id} className="scroll-mt-6">
                {section.heading[lang]}
              </h3>
              {section.blocks.map((block, index) => (
                <Block key={index} block={block} lang={lang} />
              ))}
            </section>
          ))}
          <p className="text-sm">
            <a className={linkClass} href={`#${TOC_ID}`}>
              {t(($) => $.backToContents)}
            </a>
          </p>
        </section>
      ))}
    </article>
  );
}
