import Link from 'next/link';
import type { ButtonHTMLAttributes, ComponentProps, ReactNode } from 'react';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet';
export type ButtonSize = 'sm' | 'md';

const BASE =
  'inline-flex items-center justify-center gap-1.5 rounded font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-60 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-ledger-600';
const VARIANTS: Record<ButtonVariant, string> = {
  primary: 'bg-ledger-700 text-white hover:bg-ledger-800',
  secondary: 'border border-stone-300 bg-white text-stone-800 hover:border-ledger-600 hover:text-ledger-800',
  danger: 'border border-red-300 bg-white text-red-700 hover:bg-red-50',
  quiet: 'text-ledger-700 hover:bg-ledger-50 hover:text-ledger-800',
};
const SIZES: Record<ButtonSize, string> = { sm: 'px-2.5 py-1 text-sm', md: 'px-4 py-2 text-sm' };

export function buttonClasses(variant: ButtonVariant = 'primary', size: ButtonSize = 'md', extra = ''): string {
  return `${BASE} ${VARIANTS[variant]} ${SIZES[size]} ${extra}`.trim();
}

export function Button({ variant = 'primary', size = 'md', className = '', type = 'button', ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant; size?: ButtonSize }) {
  return <button type={type} className={buttonClasses(variant, size, className)} {...rest} />;
}

export function LinkButton({ variant = 'primary', size = 'md', className = '', children, ...rest }: ComponentProps<typeof Link> & { variant?: ButtonVariant; size?: ButtonSize; children: ReactNode }) {
  return (
    <Link className={buttonClasses(variant, size, className)} {...rest}>
      {children}
    </Link>
  );
}
