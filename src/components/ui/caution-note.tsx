import { cva } from 'class-variance-authority';
import { useId } from 'react';
import { useTranslation } from 'react-i18next';
import { cautions, type CautionId, type CautionSeverity, type Language } from '@shared/content/cautions';
import { cn } from '@/lib/utils';

type HeadingLevel = 2 | 3 | 4 | 5 | 6;

// Same tones as src/components/ui/alert.tsx: warning = amber, info = slate.
const noteVariants = cva('scroll-mt-6 rounded-lg border px-4 py-3 text-sm', {
  variants: {
    severity: {
      warning: 'border-amber-300 bg-amber-50 text-amber-900',
      info: 'border-slate-200 bg-slate-50 text-slate-800',
    },
  },
  defaultVariants: { severity: 'info' },
});

const deferVariants = cva('mt-2 border-t pt-2 font-medium', {
  variants: {
    severity: {
      warning: 'border-amber-200',
      info: 'border-slate-200',
    },
  },
  defaultVariants: { severity: 'info' },
});

/** Severity in words as well as colour, so it never depends on colour alone. */
const severityLabel: Record<CautionSeverity, Record<Language, string>> = {
  warning: { en: 'Caution', es: 'Precaución' },
  info: { en: 'Good to know', es: 'Para tener en cuenta' },
};

function SeverityIcon({ severity }: { severity: CautionSeverity }) {
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 20 20" className="mt-0.5 h-5 w-5 shrink-0" fill="none" stroke="currentColor" strokeWidth={1.6}>
      {severity === 'warning' ? (
        <>
          <path d="M10 2.8 18 17H2L10 2.8Z" strokeLinejoin="round" />
          <path d="M10 8v4.2M10 14.6v.1" strokeLinecap="round" />
        </>
      ) : (
        <>
          <circle cx="10" cy="10" r="7.5" />
          <path d="M10 9v5M10 6.2v.1" strokeLinecap="round" />
        </>
      )}
    </svg>
  );
}

/** The language the screen is shown in (src/i18n), as one of the catalogue's. */
function useUiLanguage(): Language {
  const { i18n } = useTranslation();
  return i18n.resolvedLanguage === 'es' ? 'es' : 'en';
}

export interface CautionNoteProps {
  /** The caution to show (an id of the shared catalogue). */
  id: CautionId;
  /** Defaults to the screen's language; pass one only to show a caution in another language on purpose. */
  lang?: Language;
  /** Heading level that fits the surrounding outline; default 3. */
  headingLevel?: HeadingLevel;
  /** Optional DOM id, so the note can be the target of an in-page link. */
  anchorId?: string;
  className?: string;
}

/** One caution as an accessible callout: a note landmark named by its heading. */
export function CautionNote({ id, lang: langProp, headingLevel = 3, anchorId, className }: CautionNoteProps) {
  const uiLang = useUiLanguage();
  const lang = langProp ?? uiLang;
  const headingId = useId();
  const caution = cautions[id];
  const Heading = `h${headingLevel}` as const;
  return (
    <div role="note" aria-labelledby={headingId} id={anchorId} lang={lang} className={cn(noteVariants({ severity: caution.severity }), className)}>
      <div className="flex gap-3">
        <SeverityIcon severity={caution.severity} />
        <div className="min-w-0">
          <Heading id={headingId} className="flex flex-wrap items-baseline gap-x-2 text-base font-semibold text-inherit">
            <span className="text-xs font-semibold uppercase tracking-wide">
              {severityLabel[caution.severity][lang]}
              <span className="sr-only">:</span>
            </span>
            <span>{caution.title[lang]}</span>
          </Heading>
          <p className="mt-1">{caution.body[lang]}</p>
          <p className={deferVariants({ severity: caution.severity })}>{caution.defersTo[lang]}</p>
        </div>
      </div>
    </div>
  );
}

export interface CautionListProps {
  ids: readonly CautionId[];
  /** Defaults to the screen's language. */
  lang?: Language;
  headingLevel?: HeadingLevel;
  className?: string;
}

/** Several cautions, each once, as a list; renders nothing when there are none. */
export function CautionList({ ids, lang, headingLevel = 3, className }: CautionListProps) {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return null;
  return (
    // role="list" keeps list semantics in Safari once Tailwind removes the bullets.
    <ul role="list" className={cn('space-y-3', className)}>
      {unique.map((cautionId) => (
        <li key={cautionId}>
          <CautionNote id={cautionId} lang={lang} headingLevel={headingLevel} />
        </li>
      ))}
    </ul>
  );
}
