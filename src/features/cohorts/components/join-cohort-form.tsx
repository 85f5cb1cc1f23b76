import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { joinCohortInputSchema, type CohortSummary } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Choice, ChoiceGroup } from '@/components/ui/choice-group';
import { InputField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useJoinCohort } from '../api/join-cohort';

type FormValues = z.input<typeof joinCohortInputSchema>;

/** Join a cohort with the 8-character code a lead handed out. */
export function JoinCohortForm({ defaultCode = '', onJoined }: { defaultCode?: string; onJoined: (cohort: CohortSummary) => void }) {
  const join = useJoinCohort();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FormValues, unknown, z.output<typeof joinCohortInputSchema>>({
    resolver: zodResolver(joinCohortInputSchema),
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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Join with a code">
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField
        label="Join code"
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
        placeholder="K7QM-4XPA"
        hint="8 letters and digits from your cohort lead. Dashes and spaces do not matter."
        className="h-12 font-mono text-lg tracking-widest uppercase"
        {...register('code')}
        error={formState.errors.code?.message}
      />
      <ChoiceGroup legend="Join as" error={formState.errors.role?.message}>
        <Choice label="Contributor" hint="I run trials and share them with the cohort." value="contributor" {...register('role')} />
        <Choice label="Observer" hint="I read and export the pooled data (students)." value="observer" {...register('role')} />
      </ChoiceGroup>
      <Button type="submit" size="lg" className="w-full sm:w-auto" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Joining…' : 'Join cohort'}
      </Button>
    </form>
  );
}
