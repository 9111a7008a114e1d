import FormControl from '@mui/joy/FormControl';
import FormLabel from '@mui/joy/FormLabel';
import Input from '@mui/joy/Input';
import { useEffect, useState } from 'react';

/** A search box that asks the server only once typing pauses, not on every key. */
export function SearchField({
  label,
  value,
  onChange,
  placeholder,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  placeholder?: string;
}) {
  const [draft, setDraft] = useState(value);
  useEffect(() => setDraft(value), [value]);
  useEffect(() => {
    if (draft === value) return;
    const timer = setTimeout(() => onChange(draft.trim()), 300);
    return () => clearTimeout(timer);
  }, [draft, value, onChange]);
  return (
    <FormControl size="sm" sx={{ minWidth: 240 }}>
      <FormLabel>{label}</FormLabel>
      <Input type="search" value={draft} placeholder={placeholder} onChange={(event) => setDraft(event.target.value)} />
    </FormControl>
  );
}
