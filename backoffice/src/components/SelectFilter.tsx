import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import { useId } from 'react';

export function SelectFilter({
  label,
  value,
  options,
  onChange,
  minWidth = 180,
}: {
  label: string;
  value: string;
  options: Array<{ value: string; label: string }>;
  onChange: (value: string) => void;
  minWidth?: number;
}) {
  const id = useId();
  return (
    <FormControl size="sm" sx={{ minWidth }}>
      <FormLabel id={id}>{label}</FormLabel>
      <Select value={value} onChange={(_, next) => onChange(next ?? '')} slotProps={{ button: { 'aria-labelledby': id } }}>
        {options.map((option) => (
          <Option key={option.value} value={option.value}>
            {option.label}
          </Option>
        ))}
      </Select>
    </FormControl>
  );
}
