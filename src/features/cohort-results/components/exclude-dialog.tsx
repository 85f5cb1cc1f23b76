import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { createExclusionInputSchema } from '@shared/schemas/cohort-results';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextareaField } from '@/components/ui/field';
import { ApiRequestError } from '@/lib/api-client';
import { issueMessage } from '@/lib/validation-messages';
import { useCreateExclusion } from '../api/create-exclusion';

export interface ExcludeTarget {
  trialId: string;
  label: string;
}

/**
 * Asks the lead why a trial is left out (required: the whole cohort reads the reason), then
 * records it. A native <dialog>: focus starts in the reason, Escape cancels, and focus goes back
 * to the button that opened it.
 */
export function ExcludeDialog({ cohortId, target, onClose }: { cohortId: string; target: ExcludeTarget | null; onClose: () => void }) {
  const { t } = useTranslation('cohortResults');
  const ref = useRef<HTMLDialogElement>(null);
  const opener = useRef<Element | null>(null);
  const titleId = useId();
  const [reason, setReason] = useState('');
  const [fieldError, setFieldError] = useState<string | undefined>();
  const create = useCreateExclusion(cohortId);

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (target && !dialog.open) {
      opener.current = document.activeElement;
      setReason('');
      setFieldError(undefined);
      create.reset();
      dialog.showModal();
    } else if (!target && dialog.open) {
      dialog.close();
      if (opener.current instanceof HTMLElement && opener.current.isConnected) opener.current.focus();
    }
    // Only opening and closing matter here; `create` is stable enough and resetting it on every render would loop.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [target]);

  const submit = async (ev: FormEvent) => {
    ev.preventDefault();
    if (!target) return;
    const parsed = createExclusionInputSchema.safeParse({ trialId: target.trialId, reason });
    if (!parsed.success) {
      // The schema's rule, in the reader's words (its own message is English).
      const issue = parsed.error.issues.find((i) => i.path[0] === 'reason');
      setFieldError(
        !issue ? t(($) => $.exclude.reasonMissing) : issue.code === 'too_small' ? t(($) => $.exclude.reasonTooShort, { count: Number(issue.minimum) }) : issueMessage(issue),
      );
      return;
    }
    setFieldError(undefined);
    try {
      await create.mutateAsync(parsed.data);
      onClose();
    } catch (err) {
      if (err instanceof ApiRequestError && err.fieldErrors.reason) setFieldError(err.fieldErrors.reason);
    }
  };

  const serverError = create.error && !(create.error instanceof ApiRequestError && create.error.fieldErrors.reason) ? create.error.message : null;

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(e) => {
        e.preventDefault();
        if (!create.isPending) onClose();
      }}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-card border border-sand-200 bg-white p-0 text-ink shadow-xl backdrop:bg-ink/50"
    >
      {target ? (
        <form className="space-y-4 p-5 sm:p-6" onSubmit={(e) => void submit(e)} noValidate>
          <h2 id={titleId}>{t(($) => $.exclude.title, { label: target.label })}</h2>
          <p className="text-ink-muted">{t(($) => $.exclude.body)}</p>
          <TextareaField
            label={t(($) => $.exclude.reason)}
            hint={t(($) => $.exclude.reasonHint)}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            error={fieldError}
            maxLength={500}
            required
            autoFocus
          />
          {serverError ? <Alert tone="error">{serverError}</Alert> : null}
          <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
            <Button variant="secondary" size="lg" className="sm:h-11 sm:text-base" onClick={onClose} disabled={create.isPending}>
              {t(($) => $.exclude.cancel)}
            </Button>
            <Button type="submit" variant="danger" size="lg" className="sm:h-11 sm:text-base" disabled={create.isPending}>
              {create.isPending ? t(($) => $.exclude.leaving) : t(($) => $.exclude.submit)}
            </Button>
          </div>
        </form>
      ) : null}
    </dialog>
  );
}
