import Button, { type ButtonProps } from '@mui/joy/Button';

/** A row's "Remove": small and plain, in red unless the row is only a draft (then `color="neutral"`). */
export function RemoveButton({ children = 'Remove', color = 'danger', ...rest }: Omit<ButtonProps, 'size' | 'variant'>) {
  return (
    <Button size="sm" variant="plain" color={color} {...rest}>
      {children}
    </Button>
  );
}
