import Box from '@mui/joy/Box';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { PanelChecks, PatchCable } from '@loomwright/shared';

const purposeWords: Record<PatchCable['purpose'], string> = {
  chain: 'main chain',
  loop_send: 'loop send',
  loop_return: 'loop return',
  function: 'extra wiring',
};

const end = (text: string, device: number | null) => (device === null ? text : `${device} ${text}`);

/** The numbered patch list: every cable the routing needs, from → to, its length and its job. */
export function CableList({ schedule }: { schedule: PanelChecks['cableSchedule'] }) {
  return (
    <Box component="section" aria-labelledby="cable-list-heading" data-testid="cable-list">
      <Typography level="title-lg" component="h3" id="cable-list-heading">
        Patch cables
      </Typography>
      <Typography level="body-sm" sx={{ mb: 1, fontVariantNumeric: 'tabular-nums' }}>
        {schedule.patchCount} patch cables ({schedule.plugCount} plugs), {Number(schedule.cableFeet)} ft of cable with{' '}
        {Number(schedule.spareFeet)} ft spare, and {schedule.barrelPlugCount} power leads. Pedal numbers match the drawing.
      </Typography>
      {/* A panel answer (kept on screen while the whole one loads) has the counts but not the list. */}
      {schedule.patches ? (
        <Box sx={{ overflowX: 'auto' }}>
          <Table
            size="sm"
            aria-labelledby="cable-list-heading"
            sx={{
              '--TableCell-paddingX': { xs: '4px', sm: '8px' },
              fontVariantNumeric: 'tabular-nums',
              '& td, & th': { verticalAlign: 'top' },
            }}
          >
            <thead>
              <tr>
                <th scope="col" style={{ width: '2.5rem' }}>
                  #
                </th>
                <th scope="col">From</th>
                <th scope="col">To</th>
                <th scope="col" style={{ width: '4.5rem' }}>
                  Length
                </th>
                <th scope="col" style={{ width: '5.5rem' }}>
                  Purpose
                </th>
              </tr>
            </thead>
            <tbody>
              {schedule.patches.map((c) => (
                <tr key={c.number}>
                  <td>{c.number}</td>
                  <td>{end(c.from, c.fromDevice)}</td>
                  <td>{end(c.to, c.toDevice)}</td>
                  <td>{Number(c.lengthFeet)} ft</td>
                  <td>{purposeWords[c.purpose]}</td>
                </tr>
              ))}
            </tbody>
          </Table>
        </Box>
      ) : (
        <Typography level="body-sm" aria-live="polite">
          Listing each cable…
        </Typography>
      )}
    </Box>
  );
}
