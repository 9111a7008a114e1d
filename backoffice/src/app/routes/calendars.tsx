import Typography from '@mui/joy/Typography';
import { ErrorNote } from 'src/components/ErrorNote';
import { PageHeader } from 'src/components/PageHeader';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { useCalendarFeeds, useMyCalendarFeed } from 'src/features/calendar-feeds/api/calendar-feeds';
import { FeedLinks } from 'src/features/calendar-feeds/components/FeedLinks';

/** The private calendar links: the owner sees every bench's and may replace each; a builder sees their own. */
export function Component() {
  const me = useMe();
  const isOwner = me.data?.role === 'owner';
  const all = useCalendarFeeds(isOwner);
  const mine = useMyCalendarFeed();
  const feeds = isOwner ? all : mine;
  return (
    <>
      <PageHeader
        title="Calendar links"
        hint="Subscribe to a bench in any calendar program that takes an iCalendar (webcal) link: each scheduled build shows on its days with the reference, the player and the hours, and moves when the build moves. Anyone with a link can read it, so keep links private."
      />
      <ErrorNote error={feeds.error} action="Reload the page to try again." />
      {feeds.isPending && !feeds.error && <PageLoading label="Loading the links…" />}
      {feeds.data && feeds.data.length === 0 && (
        <Typography level="body-md">Your account has no bench of its own on the team, so it has no calendar link.</Typography>
      )}
      {feeds.data && feeds.data.length > 0 && <FeedLinks feeds={feeds.data} canRotate={isOwner} />}
      {!isOwner && feeds.data && feeds.data.length > 0 && (
        <Typography level="body-sm" sx={{ mt: 2 }}>
          If your link went somewhere it should not, ask the owner to make a new one; the old one then stops working.
        </Typography>
      )}
    </>
  );
}
