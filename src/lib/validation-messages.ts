import { i18n } from '@/i18n';
import { formatDate, formatNumber } from './format';

/**
 * Validation messages in the reader's language, worded from what went wrong rather than from the
 * shared schemas' English text (shared/schemas stay as they are: the server uses them too).
 *
 * The facts are those of a zod 4 issue (`code`, `origin`, `minimum`, `maximum`, `inclusive`,
 * `format`, `expected`, `divisor`), whether the issue comes from the form's own check
 * (src/lib/form-errors.ts `localizedZodResolver`) or from the server's `validation_failed`
 * details, which carry the same facts as `issue` (server/middleware/validate.ts).
 */
export interface IssueFacts {
  code: string;
  origin?: string;
  minimum?: unknown;
  maximum?: unknown;
  inclusive?: unknown;
  format?: string;
  expected?: string;
  divisor?: unknown;
}

const num = (v: unknown) => (typeof v === 'bigint' ? Number(v) : typeof v === 'number' ? v : Number(v));

/** A limit as the reader writes it: "10,000" / "10.000", a date as a date. */
function showLimit(v: unknown, origin?: string): string {
  if (origin === 'date') return v instanceof Date ? formatDate(v.toISOString()) : formatDate(String(v));
  return formatNumber(num(v), 6);
}

/** The message for one issue, in the current language. */
export function issueMessage(issue: IssueFacts): string {
  const t = i18n.t;
  switch (issue.code) {
    case 'invalid_type':
      if (issue.expected === 'int') return t(($) => $.validation.wholeNumber);
      if (issue.expected === 'number' || issue.expected === 'bigint') return t(($) => $.validation.enterNumber);
      if (issue.expected === 'date') return t(($) => $.validation.date);
      return t(($) => $.validation.required);
    case 'too_small': {
      const count = num(issue.minimum);
      if (issue.origin === 'string') return count <= 1 ? t(($) => $.validation.required) : t(($) => $.validation.minChars, { count });
      if (issue.origin === 'array' || issue.origin === 'set') return t(($) => $.validation.minItems, { count });
      const minimum = showLimit(issue.minimum, issue.origin);
      if (issue.origin === 'date') return t(($) => $.validation.minDate, { minimum });
      return issue.inclusive === false ? t(($) => $.validation.aboveNumber, { minimum }) : t(($) => $.validation.minNumber, { minimum });
    }
    case 'too_big': {
      const count = num(issue.maximum);
      if (issue.origin === 'string') return t(($) => $.validation.maxChars, { count });
      if (issue.origin === 'array' || issue.origin === 'set') return t(($) => $.validation.maxItems, { count });
      const maximum = showLimit(issue.maximum, issue.origin);
      if (issue.origin === 'date') return t(($) => $.validation.maxDate, { maximum });
      return issue.inclusive === false ? t(($) => $.validation.belowNumber, { maximum }) : t(($) => $.validation.maxNumber, { maximum });
    }
    case 'invalid_format':
      if (issue.format === 'email') return t(($) => $.validation.email);
      if (issue.format === 'url') return t(($) => $.validation.url);
      if (issue.format === 'date' || issue.format === 'datetime') return t(($) => $.validation.date);
      return t(($) => $.validation.format);
    case 'not_multiple_of':
      return t(($) => $.validation.multipleOf, { divisor: showLimit(issue.divisor) });
    case 'invalid_value':
    case 'invalid_union':
      return t(($) => $.validation.choose);
    default:
      return t(($) => $.validation.invalid);
  }
}
