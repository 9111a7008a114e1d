import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Stack from '@mui/joy/Stack';
import Switch from '@mui/joy/Switch';
import Typography from '@mui/joy/Typography';
import { useState } from 'react';
import { BuildsToMove, type HitBuild } from 'src/components/BuildsToMove';
import { ErrorNote } from 'src/components/ErrorNote';
import { formatDay, formatStamp } from 'src/lib/format';
import { useChooseHoliday } from '../api/choose-holiday';
import type { SettingsSectionProps } from './settings-section';

/**
 * The coming public holidays of the shop's country, each closed on the bench unless the owner
 * switches it off (the shop works that day), with the latest such choices below.
 */
export function HolidaysList({ settings, canEdit, onSaved }: SettingsSectionProps) {
  const choose = useChooseHoliday();
  const [hit, setHit] = useState<{ builds: HitBuild[]; reason: string } | null>(null);
  const country = new Intl.DisplayNames(['en'], { type: 'region' }).of(settings.countryCode) ?? settings.countryCode;
  return (
    <Stack gap={1}>
      <Typography level="body-xs">
        From the date-holidays dataset for {country}. The bench is closed on each one; switch a holiday to “Open” when the shop works that
        day, and builders get their usual hours then.
      </Typography>
      {settings.upcomingHolidays.length === 0 ? (
        <Typography level="body-sm">No public-holiday data for this country: add the days the shop closes under Closures.</Typography>
      ) : (
        <List size="sm" aria-label="Public holidays" sx={{ '--ListItem-paddingX': 0, columns: { md: 2 }, columnGap: 4 }}>
          {settings.upcomingHolidays.map((h) => {
            const pending = choose.isPending && choose.variables?.day === h.date;
            return (
              <ListItem key={`${h.date}-${h.name}`} sx={{ breakInside: 'avoid', justifyContent: 'space-between', gap: 1 }}>
                <Typography level="body-sm" sx={{ textDecoration: h.shopWorks ? 'line-through' : 'none' }}>
                  {formatDay(h.date)} · {h.name}
                </Typography>
                <Typography
                  component="label"
                  level="body-xs"
                  endDecorator={
                    <Switch
                      size="sm"
                      checked={h.shopWorks}
                      disabled={!canEdit || pending}
                      slotProps={{ input: { 'aria-label': `Shop works on ${h.name}, ${formatDay(h.date)}` } }}
                      onChange={(event) =>
                        choose.mutate(
                          { day: h.date, shopWorks: event.target.checked },
                          {
                            onSuccess: (answer) => {
                              const clash = answer.buildsOnBenchThen;
                              setHit(
                                answer.shopWorks || clash.length === 0
                                  ? null
                                  : { builds: clash, reason: `The shop is closed on ${formatDay(h.date)} (${h.name}).` },
                              );
                              onSaved(
                                answer.shopWorks
                                  ? `${h.name} (${formatDay(h.date)}) is a working day: the bench is open.`
                                  : clash.length === 0
                                    ? `${h.name} (${formatDay(h.date)}) is closed again.`
                                    : `${h.name} is closed again. ${clash.length === 1 ? 'One build is' : `${clash.length} builds are`} on the bench that day: move ${clash.length === 1 ? 'it' : 'them'} below.`,
                              );
                            },
                          },
                        )
                      }
                    />
                  }
                >
                  {h.shopWorks ? 'Open' : 'Closed'}
                </Typography>
              </ListItem>
            );
          })}
        </List>
      )}
      {hit && <BuildsToMove builds={hit.builds} reason={hit.reason} onDone={onSaved} />}
      <ErrorNote error={choose.error} />
      {settings.holidayHistory.length > 0 && (
        <Stack gap={0.25}>
          <Typography level="title-sm" component="h3">
            Changes to holidays
          </Typography>
          {settings.holidayHistory.map((c) => (
            <Typography level="body-xs" key={`${c.day}-${c.decidedAt}`}>
              {formatStamp(c.decidedAt)}: {c.decidedBy ?? 'A former team member'}{' '}
              {c.shopWorks ? 'opened the bench on' : 'closed the bench again on'} {c.name}, {formatDay(c.day)}.
            </Typography>
          ))}
        </Stack>
      )}
    </Stack>
  );
}
