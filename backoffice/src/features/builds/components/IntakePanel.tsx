import Button from '@mui/joy/Button';
import Input from '@mui/joy/Input';
import Option from '@mui/joy/Option';
import Select from '@mui/joy/Select';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { intakeChecklist, recordIntakeSchema, type BookingDetail, type IntakeItemView } from '@loomwright/shared';
import { useEffect, useState } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatStamp } from 'src/lib/format';
import { useRecordIntake, type IntakeItemInput } from '../api/record-intake';
import { RemoveButton } from 'src/components/RemoveButton';

/**
 * What to check, in signal-chain order: what was already recorded (so recording again corrects
 * it, never duplicates it), then the rig's items not yet recorded.
 */
function itemsToCheck(configuration: BookingDetail['configuration'], recorded: IntakeItemView[] | undefined): IntakeItemInput[] {
  const done = (recorded ?? []).map((i) => ({ item: i.item, condition: i.condition, note: i.note }));
  const keys = new Set((recorded ?? []).map((i) => i.key));
  const rest = intakeChecklist(configuration)
    .filter((c) => !keys.has(c.key))
    .map((c) => ({ item: c.item, condition: 'working' as const, note: '' }));
  return [...done, ...rest];
}

/**
 * Intake: the builder tests each pedal and the supply on arrival and records it as working or
 * faulty. A fault found here was there before the build, so the player hears of it first.
 */
export function IntakePanel({ booking, intake }: { booking: BookingDetail; intake: IntakeItemView[] | undefined }) {
  const record = useRecordIntake(booking.id);
  const configuration = booking.configuration;
  const [rows, setRows] = useState<IntakeItemInput[]>(() => itemsToCheck(configuration, intake));
  // The rows follow the booking's pedals and what was recorded (query data keeps its identity
  // until it really changes, so a refetch of the same answer does not reset what is being typed).
  useEffect(() => setRows(itemsToCheck(configuration, intake)), [configuration, intake]);
  const canRecord = ['scheduled', 'pedals_received', 'on_bench'].includes(booking.state);
  const [problem, setProblem] = useState<string | null>(null);
  const submit = () => {
    const items = rows.filter((r) => r.item.trim()).map((r) => ({ ...r, item: r.item.trim(), note: r.note?.trim() || undefined }));
    // The API's own rule: a faulty item says what is wrong.
    const parsed = recordIntakeSchema.safeParse({ items });
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      const row = typeof issue?.path[1] === 'number' ? items[issue.path[1]]?.item : undefined;
      return setProblem(`${row ? `${row}: ` : ''}${issue?.message ?? 'Check the items.'}`);
    }
    setProblem(null);
    record.mutate(items);
  };
  const setRow = (index: number, patch: Partial<IntakeItemInput>) =>
    setRows((current) => current.map((row, i) => (i === index ? { ...row, ...patch } : row)));

  return (
    <Stack gap={1}>
      {intake && intake.length > 0 && (
        <Table size="sm" aria-label="Intake recorded" sx={{ '--TableCell-height': '28px' }}>
          <thead>
            <tr>
              <th>Item</th>
              <th>Condition</th>
              <th>Note</th>
              <th>Recorded</th>
            </tr>
          </thead>
          <tbody>
            {intake.map((i) => (
              <tr key={i.id}>
                <td>{i.item}</td>
                <td>
                  <Typography
                    level="body-sm"
                    color={i.condition === 'faulty' ? 'danger' : undefined}
                    fontWeight={i.condition === 'faulty' ? 'lg' : undefined}
                  >
                    {i.condition === 'faulty' ? 'Faulty on arrival' : 'Working'}
                  </Typography>
                </td>
                <td>{i.note || '—'}</td>
                <td>
                  {i.recordedBy} · {formatStamp(i.createdAt)}
                </td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
      {intake && intake.length === 0 && !canRecord && <Typography level="body-sm">No intake recorded.</Typography>}
      {canRecord && (
        <Stack
          gap={1}
          component="form"
          onSubmit={(event) => {
            event.preventDefault();
            submit();
          }}
        >
          <Typography level="body-sm">
            {intake?.length
              ? 'Correct an item by changing it here and recording again; each item is kept once, in chain order, with the change in the history.'
              : 'Test each item as it comes out of the parcel and record it.'}{' '}
            A faulty item needs a note saying what is wrong; it is reported to the player before the build starts.
          </Typography>
          <Table size="sm" aria-label="Intake to record" sx={{ '--TableCell-height': '36px' }}>
            <thead>
              <tr>
                <th style={{ width: '34%' }}>Item</th>
                <th style={{ width: 150 }}>Condition</th>
                <th>Note</th>
                <th style={{ width: 80 }} />
              </tr>
            </thead>
            <tbody>
              {rows.map((row, index) => (
                <tr key={index}>
                  <td>
                    <Input
                      size="sm"
                      value={row.item}
                      onChange={(e) => setRow(index, { item: e.target.value })}
                      slotProps={{ input: { 'aria-label': `Item ${index + 1}` } }}
                    />
                  </td>
                  <td>
                    <Select
                      size="sm"
                      value={row.condition}
                      onChange={(_, v) => v && setRow(index, { condition: v })}
                      slotProps={{ button: { 'aria-label': `Condition of ${row.item || `item ${index + 1}`}` } }}
                    >
                      <Option value="working">Working</Option>
                      <Option value="faulty">Faulty</Option>
                    </Select>
                  </td>
                  <td>
                    <Input
                      size="sm"
                      value={row.note}
                      placeholder={row.condition === 'faulty' ? 'What is wrong' : ''}
                      onChange={(e) => setRow(index, { note: e.target.value })}
                      slotProps={{ input: { 'aria-label': `Note on ${row.item || `item ${index + 1}`}` } }}
                    />
                  </td>
                  <td>
                    <RemoveButton color="neutral" onClick={() => setRows((r) => r.filter((_, i) => i !== index))} />
                  </td>
                </tr>
              ))}
            </tbody>
          </Table>
          <Stack direction="row" gap={1}>
            <Button
              size="sm"
              variant="outlined"
              color="neutral"
              onClick={() => setRows((r) => [...r, { item: '', condition: 'working', note: '' }])}
            >
              Add an item
            </Button>
            <Button size="sm" type="submit" loading={record.isPending} disabled={rows.every((r) => !r.item.trim())}>
              Record intake
            </Button>
          </Stack>
          {problem && (
            <Typography level="body-sm" color="danger" role="alert">
              {problem}
            </Typography>
          )}
          <ErrorNote error={record.error} />
          {record.isSuccess && (
            <Typography level="body-sm" role="status">
              Intake recorded.
            </Typography>
          )}
        </Stack>
      )}
    </Stack>
  );
}
