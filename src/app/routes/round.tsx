import { useTranslation } from 'react-i18next';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { paths } from '@/config/paths';
import { RoundScreen } from '@/features/round/components/round-screen';
import { useTrial } from '@/features/trials/api/get-trial';

export function RoundPage() {
  const { trialId = '' } = useParams();
  const trial = useTrial(trialId);
  const [params] = useSearchParams();
  const { t } = useTranslation('round');
  if (trial.isPending) return <p role="status">{t(($) => $.page.loading)}</p>;
  if (trial.isError) return <Alert tone="error">{trial.error.message}</Alert>;
  if (trial.data.status !== 'active') {
    return (
      <Alert tone="warning">
        {t(($) => $.page.notActive, { status: t(($) => $.page.status[trial.data.status]) })}{' '}
        <Link className="underline" to={paths.trial(trialId)}>
          {t(($) => $.page.backToTrial)}
        </Link>
      </Alert>
    );
  }
  return (
    <div className="space-y-3">
      <Link className="text-sm text-terracotta-700 underline" to={paths.trial(trialId)}>
        ← {trial.data.title}
      </Link>
      <RoundScreen trialId={trialId} title={trial.data.title} timeZone={trial.data.timeZone} focusPotId={params.get('pot')} />
    </div>
  );
}
