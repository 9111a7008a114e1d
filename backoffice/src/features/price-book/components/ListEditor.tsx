import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Checkbox from '@mui/joy/Checkbox';
import Input from '@mui/joy/Input';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Table from '@mui/joy/Table';
import type { PriceBook } from '@loomwright/shared';
import { Controller, get, useFieldArray, useFormState, type Control, type UseFormRegister } from 'react-hook-form';
import { RemoveButton } from 'src/components/RemoveButton';

export type ListName = 'surfaces' | 'cases' | 'functions' | 'levels';

export interface FieldSpec {
  name: string;
  label: string;
  kind: 'text' | 'money' | 'int' | 'bool' | 'select';
  options?: Array<{ value: string; label: string }>;
  width?: number | string;
}

/** One list of the price book as an editable table: a row per item, add and remove. */
export function ListEditor({
  list,
  fields: specs,
  control,
  register,
  disabled,
  blank,
  fixedRows = false,
}: {
  list: ListName;
  fields: FieldSpec[];
  control: Control<PriceBook>;
  register: UseFormRegister<PriceBook>;
  disabled: boolean;
  blank?: () => PriceBook[ListName][number];
  fixedRows?: boolean;
}) {
  const { fields, append, remove } = useFieldArray({ control, name: list as 'surfaces' });
  // A cell the browser's check or the API refused shows red; its words are in the list above Publish.
  const { errors } = useFormState({ control, name: list });
  return (
    <>
      {/* On a phone the table scrolls sideways inside its card; the page itself never grows wider than the screen. */}
      <Box sx={{ overflowX: 'auto', maxWidth: '100%' }}>
        <Table
          size="sm"
          aria-label={`Price book: ${list}`}
          sx={{ minWidth: 600, '--TableCell-height': '36px', '& td': { verticalAlign: 'top' } }}
        >
          <thead>
            <tr>
              {specs.map((s) => (
                <th key={s.name} style={{ width: s.width }}>
                  {s.label}
                </th>
              ))}
              {!fixedRows && !disabled && <th style={{ width: 80 }} />}
            </tr>
          </thead>
          <tbody>
            {fields.map((row, index) => (
              <tr key={row.id}>
                {specs.map((s) => {
                  const path = `${list}.${index}.${s.name}` as 'surfaces.0.name';
                  const label = `${s.label}, row ${index + 1}`;
                  if (s.kind === 'bool')
                    return (
                      <td key={s.name}>
                        <Controller
                          control={control}
                          name={path as 'surfaces.0.custom'}
                          render={({ field }) => (
                            <Checkbox
                              checked={Boolean(field.value)}
                              disabled={disabled}
                              onChange={(e) => field.onChange(e.target.checked)}
                              slotProps={{ input: { 'aria-label': label } }}
                            />
                          )}
                        />
                      </td>
                    );
                  if (s.kind === 'select')
                    return (
                      <td key={s.name}>
                        <Controller
                          control={control}
                          name={path}
                          render={({ field }) => (
                            <Select
                              size="sm"
                              value={field.value ?? null}
                              disabled={disabled}
                              onChange={(_, v) => v && field.onChange(v)}
                              slotProps={{ button: { 'aria-label': label } }}
                            >
                              {s.options!.map((o) => (
                                <Option key={o.value} value={o.value}>
                                  {o.label}
                                </Option>
                              ))}
                            </Select>
                          )}
                        />
                      </td>
                    );
                  return (
                    <td key={s.name}>
                      <Input
                        size="sm"
                        disabled={disabled}
                        error={Boolean(get(errors, path))}
                        startDecorator={s.kind === 'money' ? '$' : undefined}
                        inputMode={s.kind === 'text' ? undefined : 'decimal'}
                        {...register(path, s.kind === 'int' ? { valueAsNumber: true } : undefined)}
                        slotProps={{ input: { 'aria-label': label } }}
                      />
                    </td>
                  );
                })}
                {!fixedRows && !disabled && (
                  <td>
                    <RemoveButton onClick={() => remove(index)} />
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </Table>
      </Box>
      {!fixedRows && !disabled && blank && (
        <Button
          size="sm"
          variant="outlined"
          color="neutral"
          sx={{ alignSelf: 'flex-start' }}
          onClick={() => append(blank() as PriceBook['surfaces'][number])}
        >
          Add a row
        </Button>
      )}
    </>
  );
}
