import type { ButtonHTMLAttributes } from 'react';

/**
 * The one button. `tone` is what it means (primary action, plain, dangerous, a link-like action in text, a chip that
 * toggles, a toggle in a row, an editor's tool, a tab); `size` its padding. `pressed` marks a toggle or the selected tab (aria-pressed) and styles it.
 */
type Props = ButtonHTMLAttributes<HTMLButtonElement> & {
  tone?: 'primary' | 'plain' | 'danger' | 'link' | 'chip' | 'toggle' | 'tool' | 'tab';
  size?: 'md' | 'sm' | 'xs';
  pressed?: boolean;
};

const tones = {
  primary: 'rounded-md font-bold bg-accent text-on-accent hover:brightness-110',
  plain: 'rounded-md font-bold border border-line bg-panel text-ink hover:bg-field',
  danger: 'rounded-md font-bold border border-alarm bg-panel text-alarm hover:bg-field',
  link: 'underline',
  chip: 'rounded-full border',
  toggle: 'rounded-md border',
  tool: 'rounded border border-line px-2 py-0.5 text-sm font-bold aria-pressed:bg-accent aria-pressed:text-on-accent',
  tab: 'rounded-t-md',
};

const sizes = { md: 'px-4 py-2', sm: 'px-3 py-1', xs: 'px-2 py-1' };

function pressedLook(tone: NonNullable<Props['tone']>, pressed: boolean | undefined) {
  if (tone === 'chip' || tone === 'toggle') return pressed ? 'border-accent font-bold' : 'border-line';
  if (tone === 'tab') return pressed ? 'border border-b-0 border-line bg-panel font-bold' : 'text-muted';
  return '';
}

export function Button({ tone = 'primary', size = 'md', pressed, className = '', type = 'button', ...rest }: Props) {
  const padding = { link: '', tool: '', chip: 'px-2 py-0.5', toggle: sizes.xs, tab: 'px-3 py-2' }[tone as string] ?? sizes[size];
  return (
    <button
      type={type}
      aria-pressed={pressed}
      className={`${tones[tone]} ${padding} ${pressedLook(tone, pressed)} focus:outline-none focus:ring-2 focus:ring-focus disabled:opacity-50 ${className}`.replace(/\s+/g, ' ').trim()}
      {...rest}
    />
  );
}
