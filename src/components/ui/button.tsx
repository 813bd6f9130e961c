import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';

const STYLES: Record<Variant, string> = {
  primary: 'bg-ember-600 text-white hover:bg-ember-700 disabled:bg-slag-300',
  secondary: 'bg-white text-slag-900 border border-ash-200 hover:bg-ash-100 disabled:text-slag-300',
  danger: 'bg-oxide-600 text-white hover:bg-red-800 disabled:bg-slag-300',
  ghost: 'text-copper-700 hover:bg-ash-100 disabled:text-slag-300',
};

export function Button({
  variant = 'primary',
  className = '',
  type = 'button',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-medium transition-colors disabled:cursor-not-allowed ${STYLES[variant]} ${className}`}
      {...props}
    />
  );
}
