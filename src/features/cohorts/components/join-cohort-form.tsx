import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { joinCohortInputSchema, type CohortSummary } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Choice, ChoiceGroup } from '@/components/ui/choice-group';
import { InputField } from '@/components/ui/field';
import { applyServerErrors, localizedZodResolver } from '@/lib/form-errors';
import { useJoinCohort } from '../api/join-cohort';

type FormValues = z.input<typeof joinCohortInputSchema>;

/** Join a cohort with the 8-character code a lead handed out. */
export function JoinCohortForm({ defaultCode = '', onJoined }: { defaultCode?: string; onJoined: (cohort: CohortSummary) => void }) {
  const { t } = useTranslation('cohorts');
  const join = useJoinCohort();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FormValues, unknown, z.output<typeof joinCohortInputSchema>>({
    resolver: localizedZodResolver(joinCohortInputSchema, { code: (i) => (i.code === 'invalid_format' ? t(($) => $.join.codeError) : undefined) }),
    defaultValues: { code: defaultCode, role: 'contributor' },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      onJoined(await join.mutateAsync(values));
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={t(($) => $.join.form)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField
        label={t(($) => $.join.code)}
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
        placeholder="K7QM-4XPA"
        hint={t(($) => $.join.codeHint)}
        className="h-12 font-mono text-lg tracking-widest uppercase"
        {...register('code')}
        error={formState.errors.code?.message}
      />
      <ChoiceGroup legend={t(($) => $.join.as)} error={formState.errors.role?.message}>
        <Choice label={t(($) => $.roles.contributor)} hint={t(($) => $.join.contributorHint)} value="contributor" {...register('role')} />
        <Choice label={t(($) => $.roles.observer)} hint={t(($) => $.join.observerHint)} value="observer" {...register('role')} />
      </ChoiceGroup>
      <Button type="submit" size="lg" className="w-full sm:w-auto" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? t(($) => $.join.submitting) : t(($) => $.join.submit)}
      </Button>
    </form>
  );
}
