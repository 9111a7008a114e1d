import { useEffect, useRef, useState } from 'react';
import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Chip from '@mui/joy/Chip';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Textarea from '@mui/joy/Textarea';
import Typography from '@mui/joy/Typography';
import visuallyHidden from '@mui/utils/visuallyHidden';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { createApiClient } from '../api-client';
import {
  MESSAGE_MAX_CHARS,
  MESSAGE_MAX_PHOTOS,
  type BuildMessageView,
  type MessageThreadView,
  type UnreadMessagesView,
} from '../message-schemas';
import { PHOTO_MAX_BYTES, PHOTO_TYPES } from '../booking-schemas';
import { messageWords } from '../words';
import { useShopFormat } from './current-shop-format';

const api = createApiClient('/api');

/** Every message query lives under ['messages']; reading or writing a thread refreshes the unread counts. */
export const messageKeys = {
  all: ['messages'] as const,
  thread: (bookingId: string) => ['messages', 'thread', bookingId] as const,
  unread: () => ['messages', 'unread'] as const,
};

/** Unread messages from the other side, per build (GET /api/messages/unread); asked again every minute. */
export const useUnreadMessages = (enabled = true) =>
  useQuery({
    queryKey: messageKeys.unread(),
    queryFn: ({ signal }) => api.get<UnreadMessagesView>('/messages/unread', { signal }),
    refetchInterval: 60_000,
    enabled,
  });

/**
 * How many messages from the other side wait unread on one build, as a small chip beside the build
 * in a list; nothing when none wait (or the count cannot be had: the list still works without it).
 */
export function UnreadMessagesBadge({ bookingId }: { bookingId: string }) {
  const unread = useUnreadMessages();
  const count = unread.data?.bookings.find((b) => b.bookingId === bookingId)?.unread ?? 0;
  return <UnreadCountChip count={count} />;
}

/** The chip itself: the number, read out in words. */
export function UnreadCountChip({ count }: { count: number }) {
  if (count <= 0) return null;
  const words = messageWords.unreadBadge(count);
  return (
    <Chip size="sm" variant="solid" color="primary" title={words} sx={{ ml: 1, verticalAlign: 'middle' }}>
      <span aria-hidden="true">{count}</span>
      {/* Read out in words instead of a bare number beside the build's name. */}
      <Box component="span" sx={visuallyHidden}>
        {` ${words}`}
      </Box>
    </Chip>
  );
}

/**
 * The conversation on a build, for the player's build page and the shop's. Opening it marks the
 * thread read for the reader's side; it asks again every 20 s while open.
 */
export function ConversationPanel({ bookingId, otherSide }: { bookingId: string; otherSide: string }) {
  const queryClient = useQueryClient();
  const format = useShopFormat();
  const thread = useQuery({
    queryKey: messageKeys.thread(bookingId),
    queryFn: async ({ signal }) => {
      const view = await api.get<MessageThreadView>(`/bookings/${encodeURIComponent(bookingId)}/messages`, { signal });
      void queryClient.invalidateQueries({ queryKey: messageKeys.unread() });
      return view;
    },
    refetchInterval: 20_000,
  });
  const [body, setBody] = useState('');
  const [files, setFiles] = useState<File[]>([]);
  const [problem, setProblem] = useState<string | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const send = useMutation({
    mutationFn: () => {
      const form = new FormData();
      form.append('body', body);
      for (const file of files) form.append('photos', file);
      return api.post<BuildMessageView>(`/bookings/${encodeURIComponent(bookingId)}/messages`, form);
    },
    onSuccess: () => {
      setBody('');
      setFiles([]);
      if (fileInput.current) fileInput.current.value = '';
      void queryClient.invalidateQueries({ queryKey: messageKeys.all });
    },
  });

  const choose = (list: FileList | null) => {
    setProblem(null);
    const chosen = [...(list ?? [])];
    if (chosen.length > MESSAGE_MAX_PHOTOS) return setProblem(messageWords.tooManyPhotos(MESSAGE_MAX_PHOTOS));
    const wrong = chosen.find((f) => !(PHOTO_TYPES as readonly string[]).includes(f.type));
    if (wrong) return setProblem(`${wrong.name} is not a JPEG, PNG or WebP photo.`);
    const big = chosen.find((f) => f.size > PHOTO_MAX_BYTES);
    if (big) return setProblem(`${big.name} is larger than 8 MB; send a smaller copy.`);
    setFiles(chosen);
  };
  const submit = () => {
    setProblem(null);
    if (!body.trim() && files.length === 0) return setProblem(messageWords.emptyMessage);
    send.mutate();
  };

  // Opening the thread marks it read, so a reader who came for a new message is brought to it once
  // (the shop's build page is long and the conversation sits low on it); later refreshes never scroll.
  const threadList = useRef<HTMLOListElement>(null);
  const broughtIntoView = useRef(false);
  useEffect(() => {
    if (broughtIntoView.current || !thread.data) return;
    broughtIntoView.current = true;
    if (thread.data.unreadBefore > 0) threadList.current?.scrollIntoView({ block: 'center' });
  }, [thread.data]);

  const messages = thread.data?.messages ?? [];
  return (
    <Stack gap={2}>
      {thread.isPending ? (
        <Typography level="body-sm">Loading the conversation…</Typography>
      ) : thread.error ? (
        <Alert color="danger" role="alert">
          {thread.error.message}
        </Alert>
      ) : messages.length === 0 ? (
        <Typography level="body-sm">No messages yet. Write to {otherSide} here; they hear of it by e-mail.</Typography>
      ) : (
        <Stack ref={threadList} component="ol" aria-label="Messages" gap={1.5} sx={{ listStyle: 'none', p: 0, m: 0 }}>
          {messages.map((m) => (
            <Box
              component="li"
              key={m.id}
              sx={{
                alignSelf: m.mine ? 'flex-end' : 'flex-start',
                maxWidth: '85%',
                p: 1.5,
                borderRadius: 'md',
                border: '1px solid',
                borderColor: 'neutral.outlinedBorder',
                bgcolor: m.mine ? 'primary.softBg' : 'background.surface',
              }}
            >
              <Typography level="body-xs" sx={{ fontWeight: 600 }}>
                {m.mine ? 'You' : m.authorName} · {format.dateTime(new Date(m.createdAt))}
              </Typography>
              {m.body && (
                <Typography level="body-md" sx={{ whiteSpace: 'pre-wrap' }}>
                  {m.body}
                </Typography>
              )}
              {m.photos.length > 0 && (
                <Stack direction="row" gap={1} sx={{ mt: 1, flexWrap: 'wrap' }}>
                  {m.photos.map((p, i) => (
                    <Link key={p.id} href={p.url} target="_blank" rel="noopener" aria-label={`Open photo ${i + 1} of the message`}>
                      <Box
                        component="img"
                        src={p.thumbnailUrl}
                        alt={`Photo ${i + 1} from ${m.mine ? 'you' : m.authorName}`}
                        loading="lazy"
                        sx={{ width: 120, aspectRatio: '4 / 3', objectFit: 'cover', borderRadius: 'sm' }}
                      />
                    </Link>
                  ))}
                </Stack>
              )}
            </Box>
          ))}
        </Stack>
      )}
      <Textarea
        minRows={2}
        placeholder={`Write to ${otherSide}`}
        value={body}
        onChange={(e) => setBody(e.target.value)}
        slotProps={{ textarea: { 'aria-label': 'Your message', maxLength: MESSAGE_MAX_CHARS } }}
      />
      <Stack direction="row" gap={1} alignItems="center" sx={{ flexWrap: 'wrap' }}>
        <input
          ref={fileInput}
          type="file"
          multiple
          accept={PHOTO_TYPES.join(',')}
          hidden
          onChange={(e) => choose(e.target.files)}
          aria-label="Attach photos"
        />
        <Button variant="outlined" onClick={() => fileInput.current?.click()}>
          Attach photos
        </Button>
        {files.length > 0 && <Typography level="body-sm">{messageWords.photoCount(files.length)}</Typography>}
        <Button onClick={submit} loading={send.isPending} sx={{ ml: 'auto' }}>
          Send message
        </Button>
      </Stack>
      <Typography level="body-xs">
        Up to {MESSAGE_MAX_PHOTOS} photos a message (JPEG, PNG or WebP, 8 MB each). Only the player and the shop see this conversation.
      </Typography>
      {(problem || send.error) && (
        <Alert color="danger" role="alert">
          {problem ?? send.error?.message}
        </Alert>
      )}
    </Stack>
  );
}
