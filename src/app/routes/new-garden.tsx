import { useNavigate } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useCreateGarden } from '@/features/gardens/api/save-garden';
import { GardenForm } from '@/features/gardens/components/garden-form';

export function NewGardenPage() {
  const navigate = useNavigate();
  const create = useCreateGarden();
  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <h1>New garden</h1>
      <p className="text-ink-muted">A garden holds your trials and its weather. Its soil and rough location feed the crop water-need sums.</p>
      <Card>
        <GardenForm submitLabel="Create garden" onSubmit={(input) => create.mutateAsync(input).then((g) => navigate(paths.garden(g.id)))} />
      </Card>
    </div>
  );
}
