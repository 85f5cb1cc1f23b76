import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useNavigate } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { useCohorts } from '@/features/cohorts/api/get-cohorts';
import { CohortList } from '@/features/cohorts/components/cohort-list';
import { CreateCohortForm } from '@/features/cohorts/components/create-cohort-form';
import { JoinCohortForm } from '@/features/cohorts/components/join-cohort-form';

export function CohortsPage() {
  const { t } = useTranslation('cohorts');
  const user = useCurrentUser();
  const cohorts = useCohorts();
  const navigate = useNavigate();
  const [creating, setCreating] = useState(false);
  const canLead = user?.role === 'educator' || user?.role === 'admin';

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1>{t(($) => $.page.title)}</h1>
          <p className="mt-1 max-w-2xl text-ink-muted">
            {t(($) => $.page.intro)}
          </p>
        </div>
        {canLead && !creating ? (
          <Button id="new-cohort-button" size="lg" onClick={() => setCreating(true)}>
            {t(($) => $.page.new)}
          </Button>
        ) : null}
      </div>

      {canLead && creating ? (
        <Card id="new-cohort" role="region" aria-labelledby="new-cohort-heading" className="max-w-3xl space-y-4">
          <div>
            <h2 id="new-cohort-heading">{t(($) => $.page.new)}</h2>
            <p className="mt-1 text-sm text-ink-muted">{t(($) => $.page.newIntro)}</p>
          </div>
          <CreateCohortForm onCreated={(c) => navigate(paths.cohort(c.id))} onCancel={() => {
              setCreating(false);
              document.getElementById('new-cohort-button')?.focus();
            }}
            autoFocus
          />
        </Card>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <section aria-labelledby="my-cohorts-heading" className="space-y-3">
          <h2 id="my-cohorts-heading">{t(($) => $.page.mine)}</h2>
          {cohorts.isPending ? (
            <p role="status" className="text-ink-muted">
              {t(($) => $.page.loading)}
            </p>
          ) : cohorts.isError ? (
            <Alert tone="error">{t(($) => $.page.loadFailed, { message: cohorts.error.message })}</Alert>
          ) : cohorts.data.length === 0 ? (
            <Card className="text-ink-muted">
              <p>{t(($) => $.page.none)}</p>
              <p className="mt-1">
                {canLead ? t(($) => $.page.noneLead) : t(($) => $.page.noneMember)}
              </p>
            </Card>
          ) : (
            <CohortList cohorts={cohorts.data} />
          )}
        </section>

        <Card role="region" aria-labelledby="join-heading" className="space-y-4 self-start">
          <div>
            <h2 id="join-heading">{t(($) => $.page.join)}</h2>
            <p className="mt-1 text-sm text-ink-muted">{t(($) => $.page.joinIntro)}</p>
          </div>
          <JoinCohortForm onJoined={(c) => navigate(paths.cohort(c.id))} />
        </Card>
      </div>
    </div>
  );
}
