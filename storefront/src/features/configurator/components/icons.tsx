import SvgIcon, { type SvgIconProps } from '@mui/joy/SvgIcon';

// Our own simple line icons, drawn on a 24-unit grid.
const icon = (d: string) =>
  function Icon(props: SvgIconProps) {
    return (
      <SvgIcon {...props} aria-hidden>
        <path d={d} fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
      </SvgIcon>
    );
  };

export const CheckIcon = icon('M5 12.5l4.5 4.5L19 7.5');
export const ArrowUpIcon = icon('M12 19V5M6 11l6-6 6 6');
export const ArrowDownIcon = icon('M12 5v14M6 13l6 6 6-6');
export const RemoveIcon = icon('M5 7h14M10 7V5h4v2M7 7l1 12h8l1-12');
export const PlusIcon = icon('M12 5v14M5 12h14');
export const MinusIcon = icon('M5 12h14');
export const CautionIcon = icon('M12 4l9 16H3L12 4zM12 10v4M12 17v.5');
export const InfoIcon = icon('M12 21a9 9 0 100-18 9 9 0 000 18zM12 11v6M12 7.5v.5');
export const BoltIcon = icon('M13 3L5 14h6l-1 7 8-11h-6l1-7z');
