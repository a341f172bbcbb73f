import type { ButtonHTMLAttributes, Ref } from 'react';

type Variant = 'primary' | 'quiet' | 'danger';

const styles: Record<Variant, string> = {
  primary: 'bg-tube-600 text-white hover:bg-tube-700 disabled:bg-ink-faint',
  quiet: 'bg-paper-raised text-ink border border-rule hover:bg-paper-sunk disabled:text-ink-faint',
  danger: 'bg-fault text-white hover:opacity-90 disabled:bg-ink-faint',
};

export function Button({
  variant = 'primary',
  className = '',
  type = 'button',
  ref,
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; ref?: Ref<HTMLButtonElement> }) {
  return (
    <button
      ref={ref}
      type={type}
      {...props}
      className={`inline-flex items-center justify-center gap-2 whitespace-nowrap rounded px-3 py-1.5 text-sm font-medium disabled:cursor-not-allowed ${styles[variant]} ${className}`}
    />
  );
}
