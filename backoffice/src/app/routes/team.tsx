import Button from '@mui/joy/Button';
import Chip from '@mui/joy/Chip';
import Sheet from '@mui/joy/Sheet';
import Stack from '@mui/joy/Stack';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import type { TeamMember } from '@loomwright/shared';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { ErrorNote } from 'src/components/ErrorNote';
import { Notice } from 'src/components/Notice';
import { PageHeader } from 'src/components/PageHeader';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { SignOutEverywhere } from 'src/features/sessions/components/SignOutEverywhere';
import { useResendInvitation } from 'src/features/invitations/api/resend-invitation';
import { useTeam } from 'src/features/team/api/get-team';
import { TeamMemberDialog, weekdays } from 'src/features/team/components/TeamMemberDialog';
import { AbsencesPanel } from 'src/features/team/components/AbsencesPanel';
import { formatHours, formatRate, formatStamp } from 'src/lib/format';

function StatusCell({ member }: { member: TeamMember }) {
  if (member.status === 'invited') {
    return (
      <>
        <Chip size="sm" variant="soft" color="warning">
          Invited
        </Chip>
        <Typography level="body-xs" sx={{ display: 'block', mt: 0.5 }}>
          {member.invitationExpiresAt ? `Link valid until ${formatStamp(member.invitationExpiresAt)}` : 'Link expired; send a fresh one'}.
          Takes no builds until they join.
        </Typography>
      </>
    );
  }
  return <>{member.status === 'active' ? 'Takes builds' : 'Not taking builds'}</>;
}

export function Component() {
  const team = useTeam();
  const me = useMe();
  const isOwner = me.data?.role === 'owner';
  const [editing, setEditing] = useState<TeamMember | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const resend = useResendInvitation();
  const resendTo = (m: TeamMember) =>
    resend.mutate(m.id, {
      onSuccess: (r) => setNotice(`A fresh invitation went to ${r.email}; the link sent before no longer works.`),
    });
  return (
    <>
      <PageHeader
        title="Team"
        actions={
          isOwner && (
            <Button component={RouterLink} to="/team/invite" color="accent">
              Invite a builder
            </Button>
          )
        }
        hint={
          isOwner
            ? 'Builders with their level, hourly rate and bench hours. The bench schedule and every new firm quote follow these.'
            : 'Builders with their level and bench hours, and your own hourly rate. Only the owner sees every rate and changes them.'
        }
      />
      <ErrorNote error={team.error} />
      <ErrorNote error={resend.error} />
      {team.isPending && <PageLoading />}
      {team.data && (
        <Sheet variant="outlined" sx={{ borderRadius: 'md', overflow: 'auto', bgcolor: 'background.surface' }}>
          <Table
            aria-label="Builders"
            size="sm"
            sx={{ '--TableCell-height': '40px', tableLayout: 'auto', '& thead th': { bgcolor: 'background.level1' } }}
          >
            <thead>
              <tr>
                <th>Builder</th>
                <th>Level</th>
                <th style={{ textAlign: 'right' }}>Hourly rate</th>
                {weekdays.map(([d, name]) => (
                  <th key={d} style={{ textAlign: 'right', width: 52 }}>
                    {name}
                  </th>
                ))}
                <th style={{ textAlign: 'right' }}>Per week</th>
                <th>Status</th>
                {isOwner && <th style={{ width: 250 }} />}
              </tr>
            </thead>
            <tbody>
              {team.data.map((m) => (
                <tr key={m.id}>
                  <td>
                    <strong>{m.name}</strong>
                    <Typography level="body-xs" sx={{ display: 'block' }}>
                      {m.email}
                    </Typography>
                  </td>
                  <td>{m.level}</td>
                  <td style={{ textAlign: 'right' }}>
                    {m.hourlyRate ? (
                      formatRate(m.hourlyRate)
                    ) : (
                      <Typography level="body-xs" title="Only the owner sees colleagues' rates">
                        owner only
                      </Typography>
                    )}
                  </td>
                  {weekdays.map(([d]) => (
                    <td key={d} style={{ textAlign: 'right' }}>
                      {m.weeklyHours[d] ? m.weeklyHours[d] : <Typography level="body-xs">off</Typography>}
                    </td>
                  ))}
                  <td style={{ textAlign: 'right' }}>{formatHours(m.weeklyCapacityHours)}</td>
                  <td>
                    <StatusCell member={m} />
                  </td>
                  {isOwner && (
                    <td>
                      <Stack direction="row" gap={1}>
                        <Button size="sm" variant="outlined" onClick={() => setEditing(m)} aria-label={`Edit ${m.name}`}>
                          Edit
                        </Button>
                        {m.status === 'invited' ? (
                          <Button
                            size="sm"
                            variant="outlined"
                            loading={resend.isPending && resend.variables === m.id}
                            onClick={() => resendTo(m)}
                            aria-label={`Resend the invitation to ${m.name}`}
                          >
                            Resend invitation
                          </Button>
                        ) : (
                          <SignOutEverywhere userId={m.userId} name={m.name} onDone={setNotice} />
                        )}
                      </Stack>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </Table>
        </Sheet>
      )}
      {team.data && <AbsencesPanel team={team.data} canEdit={isOwner} onSaved={setNotice} />}
      <TeamMemberDialog member={editing} onClose={() => setEditing(null)} onSaved={setNotice} />
      <Notice message={notice} onClose={() => setNotice(null)} />
    </>
  );
}
