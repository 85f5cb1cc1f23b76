import { useTranslation } from 'react-i18next';
import { Alert } from '@/components/ui/alert';
import { formatDate } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { useFrostWarnings } from '../api/get-frost-warnings';

/** Gardens with a frost night (≤ 0 °C logged or forecast) today or in the next 2 days; nothing when none. */
export function FrostWarnings() {
  const { t } = useTranslation('notifications');
  const warnings = useFrostWarnings();
  const units = useUnits();
  if (!warnings.data?.length) return null;
  return (
    <Alert tone="warning" role="region" aria-label={t(($) => $.frost.label)}>
      <p className="font-medium">{t(($) => $.frost.title)}</p>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        {warnings.data.map((w) => (
          <li key={w.gardenId}>
            {t(($) => $.frost.garden, {
              garden: w.gardenName,
              count: w.potsInGround,
              nights: w.nights
                .map((n) => {
                  const night = { temp: units.fmt(n.tMinC, 'temperature'), date: formatDate(n.day) };
                  return n.forecast ? t(($) => $.frost.forecast, night) : t(($) => $.frost.logged, night);
                })
                .join('; '),
            })}
          </li>
        ))}
      </ul>
    </Alert>
  );
}
