import type { ButtonHTMLAttributes } from 'react';
import { Link, type LinkProps } from 'react-router';

type Variant = 'primary' | 'secondary' | 'danger' | 'quiet';
type Size = 'sm' | 'md' | 'lg';

const variants: Record<Variant, string> = {
  primary: 'bg-field-700 text-white hover:bg-field-800 disabled:bg-field-300',
  secondary: 'bg-white text-field-800 ring-1 ring-inset ring-soil-300 hover:bg-straw-100 disabled:text-soil-400',
  danger: 'bg-patch-700 text-white hover:bg-patch-600 disabled:bg-patch-100 disabled:text-patch-700',
  quiet: 'text-field-700 hover:bg-field-50 hover:text-field-900 disabled:text-soil-400',
};
// lg is for the scout's phone pages: a thumb-sized target (48 px and up).
const sizes: Record<Size, string> = {
  sm: 'min-h-8 px-2.5 text-sm',
  md: 'min-h-10 px-4 text-sm',
  lg: 'min-h-12 px-5 text-base',
};

export function buttonClass(variant: Variant = 'primary', size: Size = 'md', extra = '') {
  return `inline-flex items-center justify-center gap-2 rounded-md font-medium transition-colors focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-field-600 disabled:cursor-not-allowed ${variants[variant]} ${sizes[size]} ${extra}`;
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: Size;
  busy?: boolean;
}

export function Button({ variant, size, busy, className = '', children, disabled, type = 'button', ...rest }: ButtonProps) {
  return (
    <button type={type} className={buttonClass(variant, size, className)} disabled={disabled || busy} aria-busy={busy || undefined} {...rest}>
      {busy && <span className="h-3.5 w-3.5 animate-spin rounded-full border-2 border-current border-r-transparent" aria-hidden="true" />}
      {children}
    </button>
  );
}

export function ButtonLink({ variant, size, className = '', ...rest }: LinkProps & { variant?: Variant; size?: Size }) {
  return <Link className={buttonClass(variant, size, className)} {...rest} />;
}
