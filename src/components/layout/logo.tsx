export function Logo({ compact = false }: { compact?: boolean }) {
  return (
    <span className="inline-flex items-center gap-2 text-ink">
      <img src="/seepwise.svg" alt="" width={32} height={32} />
      {compact ? null : <span className="text-xl font-semibold tracking-tight">Seepwise</span>}
    </span>
  );
}
