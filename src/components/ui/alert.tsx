import { cva, type VariantProps } from 'class-variance-authority';
import type { HTMLAttributes } from 'react';
import { cn } from '@/lib/utils';

const alertVariants = cva('rounded-lg border px-4 py-3 text-sm', {
  variants: {
    tone: {
      info: 'border-slate-200 bg-slate-50 text-slate-800',
      success: 'border-sage-200 bg-sage-50 text-sage-800',
      warning: 'border-amber-300 bg-amber-50 text-amber-900',
      error: 'border-red-300 bg-red-50 text-red-900',
    },
  },
  defaultVariants: { tone: 'info' },
});

export function Alert({ className, tone, role, ...props }: HTMLAttributes<HTMLDivElement> & VariantProps<typeof alertVariants>) {
  return <div role={role ?? (tone === 'error' ? 'alert' : 'status')} className={cn(alertVariants({ tone }), className)} {...props} />;
}
