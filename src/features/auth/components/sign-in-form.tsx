import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm, type Resolver } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { SignInInput } from '@shared/schemas/auth';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField } from '@/components/ui/field';
import { paths } from '@/config/paths';
import { applyServerErrors, localizedZodResolver, type FieldMessage } from '@/lib/form-errors';
import { useSignIn } from '../api/auth-mutations';

/**
 * The shared schema (shared/schemas/auth.ts `signInInputSchema`), fetched as its own chunk the
 * first time the form is touched: the sign-in page is the first page people see, and zod kept out
 * of its bundle is what keeps it under the 180 KB target (bench figure 6). One request, shared.
 */
let schemaRequest: Promise<(typeof import('@shared/schemas/auth'))['signInInputSchema']> | null = null;
const loadSchema = () => (schemaRequest ??= import('@shared/schemas/auth').then((m) => m.signInInputSchema));

/** zodResolver with the shared schema (localizedZodResolver: messages in the reader's language), once the schema has loaded. */
function lazySchemaResolver(messages: Partial<Record<keyof SignInInput, FieldMessage>>): Resolver<SignInInput> {
  return async (values, context, options) => localizedZodResolver(await loadSchema(), messages)(values, context, options);
}

/**
 * Validates with the same zod schema as the server (react-hook-form + a zod resolver, as the
 * other forms), worded in the reader's language; the schema loads lazily (see `loadSchema`).
 */
export function SignInForm({ onSuccess }: { onSuccess: () => void }) {
  const { t } = useTranslation('auth');
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SignInInput>({
    resolver: lazySchemaResolver({ password: (i) => (i.code === 'too_small' ? t(($) => $.fields.passwordRequired) : undefined) }),
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signIn.mutateAsync(values);
      onSuccess();
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });

  return (
    // Focus inside the form starts fetching the schema, so it is usually there before the first submit.
    <form onSubmit={onSubmit} onFocus={() => void loadSchema()} noValidate className="space-y-4" aria-label={t(($) => $.signIn.form)}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <InputField label={t(($) => $.fields.email)} type="email" autoComplete="email" {...register('email')} error={formState.errors.email?.message} />
      <InputField label={t(($) => $.fields.password)} type="password" autoComplete="current-password" {...register('password')} error={formState.errors.password?.message} />
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? t(($) => $.signIn.submitting) : t(($) => $.signIn.submit)}
      </Button>
      <div className="flex flex-wrap justify-between gap-x-4 gap-y-2 text-sm">
        <Link className="text-terracotta-700 underline" to={paths.forgotPassword}>
          {t(($) => $.signIn.forgot)}
        </Link>
        <Link className="text-terracotta-700 underline" to={paths.signUp}>
          {t(($) => $.signIn.createAccount)}
        </Link>
      </div>
    </form>
  );
}
