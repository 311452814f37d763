import type { ButtonHTMLAttributes } from 'react';

type Tone = 'primary' | 'secondary' | 'danger' | 'ghost';

const TONES: Record<Tone, string> = {
  primary: 'bg-damson-700 text-pith-50 hover:bg-damson-800 disabled:bg-damson-300',
  secondary: 'bg-pith-50 text-damson-800 ring-1 ring-inset ring-damson-200 hover:bg-damson-50',
  danger: 'bg-ember-600 text-white hover:bg-ember-700 disabled:bg-ember-100',
  ghost: 'text-damson-700 hover:bg-damson-50',
};

export function buttonClass(tone: Tone = 'primary', extra = '') {
  return `inline-flex min-h-10 items-center justify-center gap-2 rounded-lg px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed ${TONES[tone]} ${extra}`;
}

export function Button({ tone = 'primary', className = '', ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone }) {
  return <button className={buttonClass(tone, className)} {...rest} />;
}
