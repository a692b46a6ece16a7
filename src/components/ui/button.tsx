import type { ButtonHTMLAttributes } from 'react';

type Props = ButtonHTMLAttributes<HTMLButtonElement> & { tone?: 'primary' | 'plain' | 'danger' };

const tones = {
  primary: 'bg-accent text-on-accent hover:brightness-110',
  plain: 'border border-line bg-panel text-ink hover:bg-field',
  danger: 'border border-alarm bg-panel text-alarm hover:bg-field',
};

export function Button({ tone = 'primary', className = '', type = 'button', ...rest }: Props) {
  return (
    <button
      type={type}
      className={`rounded-md px-4 py-2 font-bold focus:outline-none focus:ring-2 focus:ring-focus disabled:opacity-50 ${tones[tone]} ${className}`}
      {...rest}
    />
  );
}
