import { useEffect, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Button, type ButtonProps } from './button';

/** Copies a value to the clipboard and says so (for screen readers too). */
export function CopyButton({ value, label, copiedLabel, ...props }: Omit<ButtonProps, 'onClick' | 'value'> & { value: string; label?: string; copiedLabel?: string }) {
  const { t } = useTranslation();
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  useEffect(() => {
    if (state === 'idle') return;
    const t = setTimeout(() => setState('idle'), 2500);
    return () => clearTimeout(t);
  }, [state]);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(value);
      setState('copied');
    } catch {
      setState('failed');
    }
  };
  return (
    <span className="inline-flex flex-col items-start gap-1">
      <Button variant="secondary" {...props} onClick={() => void copy()}>
        {state === 'copied' ? (copiedLabel ?? t(($) => $.copy.copied)) : (label ?? t(($) => $.copy.copy))}
      </Button>
      <span role="status" aria-live="polite" className="text-sm text-ink-muted">
        {state === 'copied' ? t(($) => $.copy.done) : state === 'failed' ? t(($) => $.copy.failed) : ''}
      </span>
    </span>
  );
}
