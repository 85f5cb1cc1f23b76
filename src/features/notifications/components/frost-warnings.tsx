import { Alert } from '@/components/ui/alert';
import { formatDate } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { useFrostWarnings } from '../api/get-frost-warnings';

/** Gardens with a frost night (≤ 0 °C logged or forecast) today or in the next 2 days; nothing when none. */
export function FrostWarnings() {
  const warnings = useFrostWarnings();
  const units = useUnits();
  if (!warnings.data?.length) return null;
  return (
    <Alert tone="warning" role="region" aria-label="Frost warnings">
      <p className="font-medium">Frost ahead: empty or lift your pots before the night. Water left in the clay freezes and cracks it; local advice comes first.</p>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        {warnings.data.map((w) => (
          <li key={w.gardenId}>
            {w.gardenName} ({w.potsInGround} {w.potsInGround === 1 ? 'pot' : 'pots'} in the ground):{' '}
            {w.nights.map((n) => `${units.fmt(n.tMinC, 'temperature')} ${n.forecast ? 'forecast' : 'logged'} for ${formatDate(n.day)}`).join('; ')}
          </li>
        ))}
      </ul>
    </Alert>
  );
}
