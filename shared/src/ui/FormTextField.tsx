import FormControl from '@mui/joy/FormControl';
import FormHelperText from '@mui/joy/FormHelperText';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import type { InputHTMLAttributes } from 'react';
import type { FieldError, UseFormRegisterReturn } from 'react-hook-form';

interface Props {
  label: string;
  registration: UseFormRegisterReturn;
  error?: FieldError;
  hint?: string;
  type?: InputHTMLAttributes<HTMLInputElement>['type'];
  autoComplete?: string;
  autoFocus?: boolean;
}

/** A labelled input whose error (in the shared schema's words) is read out with the field. */
export function FormTextField({ label, registration, error, hint, type = 'text', autoComplete, autoFocus }: Props) {
  const message = error?.message ?? hint;
  return (
    <FormControl error={!!error}>
      <FormLabel>{label}</FormLabel>
      <Input type={type} autoComplete={autoComplete} autoFocus={autoFocus} {...registration} />
      {message && <FormHelperText>{message}</FormHelperText>}
    </FormControl>
  );
}
