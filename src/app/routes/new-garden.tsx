import { useTranslation } from 'react-i18next';
import { useNavigate } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useCreateGarden } from '@/features/gardens/api/save-garden';
import { GardenForm } from '@/features/gardens/components/garden-form';

export function NewGardenPage() {
  const navigate = useNavigate();
  const create = useCreateGarden();
  const { t } = useTranslation('gardens');
  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <h1>{t(($) => $.new.title)}</h1>
      <p className="text-ink-muted">{t(($) => $.new.intro)}</p>
      <Card>
        <GardenForm submitLabel={t(($) => $.new.create)} onSubmit={(input) => create.mutateAsync(input).then((g) => navigate(paths.garden(g.id)))} />
      </Card>
    </div>
  );
}
