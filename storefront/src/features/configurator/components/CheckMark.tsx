import type { CSSProperties } from 'react';

/**
 * The check of icons.tsx's CheckIcon as a plain SVG, sized and coloured as Joy's SvgIcon draws it
 * (1em square, `--Icon-color` else the theme's icon colour; `color="inherit"` takes the text's).
 * The configurator's first screen (step progress, choice cards) draws only this icon, and SvgIcon
 * with the other icons ships with the later steps.
 */
export function CheckMark({ color }: { color?: 'inherit' }) {
  const style: CSSProperties = {
    width: '1em',
    height: '1em',
    display: 'inline-block',
    flexShrink: 0,
    userSelect: 'none',
    fontSize: 'var(--joy-fontSize-md)',
    color: color ?? 'var(--Icon-color, var(--joy-palette-text-icon))',
  };
  return (
    <svg viewBox="0 0 24 24" aria-hidden="true" style={style}>
      <path d="M5 12.5l4.5 4.5L19 7.5" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
