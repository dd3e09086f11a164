import type { ComponentProps } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { cn } from './cn';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost' | 'inverse';
type Size = 'md' | 'sm';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-brand-700 text-white hover:bg-brand-800 disabled:bg-brand-300',
  secondary: 'border border-ink-300 bg-white text-ink-800 hover:bg-ink-100 disabled:text-ink-400',
  danger: 'bg-danger-600 text-white hover:bg-danger-700 disabled:bg-danger-100',
  ghost: 'text-brand-700 hover:bg-brand-50 disabled:text-ink-400',
  /** On the dark header. */
  inverse: 'border border-white/30 text-white hover:bg-white/10 disabled:text-white/50',
};

/* Tap targets: 44 px tall by default (WCAG 2.5.5), 40 px for the small size. */
const SIZES: Record<Size, string> = {
  md: 'min-h-11 px-4 text-sm',
  sm: 'min-h-10 px-3 text-sm',
};

export function buttonClasses(variant: Variant = 'primary', size: Size = 'md', className?: string): string {
  return cn(
    'inline-flex items-center justify-center gap-2 rounded-md font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-60',
    VARIANTS[variant],
    SIZES[size],
    className,
  );
}

type ButtonProps = ComponentProps<'button'> & { variant?: Variant; size?: Size; busy?: boolean };

/** A button; `busy` disables it and marks it busy for assistive technology. */
export function Button({ variant, size, busy, className, disabled, type = 'button', children, ...props }: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, size, className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...props}
    >
      {busy && <span aria-hidden className="size-4 animate-spin rounded-full border-2 border-current border-t-transparent" />}
      {children}
    </button>
  );
}

/** A router link styled as a button. */
export function ButtonLink({ variant, size, className, ...props }: LinkProps & { variant?: Variant; size?: Size }) {
  return <Link className={buttonClasses(variant, size, className)} {...props} />;
}
