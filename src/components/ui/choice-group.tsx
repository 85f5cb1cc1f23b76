import { forwardRef, useId, type InputHTMLAttributes, type ReactNode } from 'react';
import { cn } from '@/lib/utils';

/** A labelled set of radio choices, each a large tappable card with an optional explanation. */
export function ChoiceGroup({ legend, error, children, className }: { legend: string; error?: string; children: ReactNode; className?: string }) {
  const id = useId();
  return (
    <fieldset className={cn('@container space-y-2', className)} aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="mb-1 block text-sm font-medium text-ink">{legend}</legend>
      {/* Side by side only where the group itself has room (not by screen width: it also sits in narrow sidebars). */}
      <div className="grid gap-2 @md:grid-cols-2">{children}</div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-red-800">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

type ChoiceProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & { label: string; hint?: ReactNode };

export const Choice = forwardRef<HTMLInputElement, ChoiceProps>(function Choice({ label, hint, className, ...props }, ref) {
  return (
    <label
      className={cn(
        'flex min-h-12 cursor-pointer items-start gap-3 rounded-lg border border-sand-300 bg-white px-3 py-2.5 hover:bg-sand-50 has-[:checked]:border-terracotta-500 has-[:checked]:bg-terracotta-50 has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-terracotta-300',
        className,
      )}
    >
      <input ref={ref} type="radio" className="mt-1 size-4 shrink-0 accent-terracotta-600" {...props} />
      <span>
        <span className="block font-medium text-ink">{label}</span>
        {hint ? <span className="block text-sm text-ink-muted">{hint}</span> : null}
      </span>
    </label>
  );
});
