import Button from '@mui/joy/Button';
import Card from '@mui/joy/Card';
import DialogActions from '@mui/joy/DialogActions';
import DialogContent from '@mui/joy/DialogContent';
import DialogTitle from '@mui/joy/DialogTitle';
import Input from '@mui/joy/Input';
import Link from '@mui/joy/Link';
import Modal from '@mui/joy/Modal';
import ModalDialog from '@mui/joy/ModalDialog';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { useRef, useState } from 'react';
import type { CalendarFeedLink } from '@loomwright/shared';
import { ErrorNote } from 'src/components/ErrorNote';
import { Notice } from 'src/components/Notice';
import { formatStamp } from 'src/lib/format';
import { useRotateCalendarFeed } from '../api/calendar-feeds';

const feedName = (feed: CalendarFeedLink) =>
  feed.scope === 'shop' ? 'The whole shop’s bench' : `${feed.builderName ?? 'A builder'}’s bench`;

/** Copies the link; where the browser gives no clipboard (a page not on https), selects it for Ctrl-C instead. */
function CopyLink({ url, label }: { url: string; label: string }) {
  const input = useRef<HTMLInputElement>(null);
  const [said, setSaid] = useState<string | null>(null);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(url);
      setSaid('Link copied');
    } catch {
      input.current?.select();
      setSaid('Selected: press Ctrl-C (⌘-C) to copy');
    }
  };
  return (
    <Stack direction={{ xs: 'column', sm: 'row' }} gap={1} alignItems={{ sm: 'center' }}>
      <Input
        readOnly
        value={url}
        slotProps={{ input: { ref: input, 'aria-label': label, onFocus: (e) => e.currentTarget.select() } }}
        sx={{ flex: 1, minWidth: 0, fontFamily: 'monospace', fontSize: 'sm' }}
      />
      <Button size="sm" variant="outlined" onClick={() => void copy()}>
        Copy link
      </Button>
      <Typography level="body-xs" role="status" sx={{ minWidth: 120 }}>
        {said}
      </Typography>
    </Stack>
  );
}

/**
 * The private calendar links: each a copy button and a way to open it in a calendar program; with
 * `canRotate` (the owner) a new link for each, after a confirm saying the old one stops working.
 */
export function FeedLinks({ feeds, canRotate }: { feeds: CalendarFeedLink[]; canRotate: boolean }) {
  const rotate = useRotateCalendarFeed();
  const [asking, setAsking] = useState<CalendarFeedLink | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  return (
    <Stack gap={2}>
      {feeds.map((feed) => (
        <Card key={feed.id} variant="outlined" component="section" aria-label={feedName(feed)}>
          <Stack direction="row" gap={1} alignItems="baseline" flexWrap="wrap">
            <Typography level="title-md" component="h2" sx={{ flex: 1 }}>
              {feedName(feed)}
            </Typography>
            <Typography level="body-xs">
              {feed.rotatedAt ? `Link made new ${formatStamp(feed.rotatedAt)}` : 'First link, never replaced'}
            </Typography>
          </Stack>
          <CopyLink url={feed.url} label={`Calendar link for ${feedName(feed)}`} />
          <Stack direction="row" gap={2} flexWrap="wrap" alignItems="center">
            <Link href={feed.webcalUrl} level="body-sm">
              Subscribe in this device’s calendar program
            </Link>
            {canRotate && (
              <Button size="sm" variant="plain" color="danger" onClick={() => setAsking(feed)}>
                Make a new link…
              </Button>
            )}
          </Stack>
        </Card>
      ))}
      <Modal open={asking !== null} onClose={() => !rotate.isPending && setAsking(null)}>
        <ModalDialog role="alertdialog" sx={{ width: 'min(520px, 96vw)' }}>
          <DialogTitle component="h2">Make a new link for {asking ? feedName(asking).toLowerCase() : ''}?</DialogTitle>
          <DialogContent sx={{ gap: 1 }}>
            <Typography level="body-sm">
              The old link stops working at once: every calendar subscribed to it stops showing new and moved builds. Send the new link to
              whoever should still see this bench; they subscribe to it again.
            </Typography>
            <ErrorNote error={rotate.error} action="Try again, or reload the page." />
          </DialogContent>
          <DialogActions>
            <Button
              color="danger"
              loading={rotate.isPending}
              onClick={() =>
                asking &&
                rotate.mutate(asking.id, {
                  onSuccess: () => {
                    setNotice(`New link made for ${feedName(asking).toLowerCase()}; the old link no longer works.`);
                    setAsking(null);
                  },
                })
              }
            >
              Make a new link
            </Button>
            <Button variant="plain" color="neutral" disabled={rotate.isPending} onClick={() => setAsking(null)}>
              Keep the old link
            </Button>
          </DialogActions>
        </ModalDialog>
      </Modal>
      <Notice message={notice} onClose={() => setNotice(null)} />
    </Stack>
  );
}
