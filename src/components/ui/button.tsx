// Buttons in three weights. Primary is for the one action a screen is for.
import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'quiet';

const VARIANTS: Record<Variant, string> = {
  primary:
    'bg-verdigris text-white border-verdigris hover:bg-verdigris-deep hover:border-verdigris-deep disabled:bg-ink-soft disabled:border-ink-soft',
  secondary:
    'bg-sheet text-ink border-rule-strong hover:bg-sheet-alt hover:border-ink disabled:text-ink-soft',
  quiet: 'bg-transparent text-verdigris border-transparent hover:bg-verdigris-tint disabled:text-ink-soft',
};

export function buttonClasses(variant: Variant = 'secondary', size: 'sm' | 'md' = 'md'): string {
  const sizing = size === 'sm' ? 'h-7 px-2.5 text-[13px]' : 'h-9 px-3.5 text-sm';
  return `inline-flex items-center justify-center gap-1.5 rounded-[3px] border font-bold whitespace-nowrap transition-colors disabled:cursor-not-allowed ${sizing} ${VARIANTS[variant]}`;
}

export function Button({
  variant = 'secondary',
  size = 'md',
  className = '',
  type = 'button',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: 'sm' | 'md' }) {
  return <button type={type} className={`${buttonClasses(variant, size)} ${className}`} {...props} />;
}
