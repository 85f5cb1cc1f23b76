import { Card } from '@/components/ui/card';
import { useCurrentUser } from '@/features/auth/api/get-session';

export function HomePage() {
  const user = useCurrentUser();
  return (
    <div className="space-y-6">
      <div>
        <h1>Hello, {user?.displayName}</h1>
        <p className="mt-1 text-ink-muted">Your gardens and trials at a glance, and what needs doing today.</p>
      </div>
      <Card>
        <h2>Getting started</h2>
        <p className="mt-2 text-ink-muted">
          Set up two matched beds with the same crop and planting date: one watered through buried clay pots, its twin at the surface. Log every refill and
          every can of water; weigh every pick. Seepwise does the sums and tells you how sure the answer is.
        </p>
      </Card>
    </div>
  );
}
