import { useRef, useState } from 'react';
import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Input from '@mui/joy/Input';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { PHOTO_MAX_BYTES, PHOTO_MAX_PER_BOOKING, PHOTO_TYPES, type PhotoView } from '@loomwright/shared';
import { useUploadPhoto } from 'src/features/bookings/api/upload-photo';

const kindWords: Record<PhotoView['kind'], string> = { customer: 'Your photo', intake: 'Check-in photo', build: 'Build photo' };

export function PhotoPanel({ bookingId, photos }: { bookingId: string; photos: PhotoView[] }) {
  const upload = useUploadPhoto();
  const fileInput = useRef<HTMLInputElement>(null);
  const [caption, setCaption] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const full = photos.length >= PHOTO_MAX_PER_BOOKING;

  const send = (file: File | undefined) => {
    setProblem(null);
    if (!file) return;
    // Quick checks for a friendly answer; the server checks the bytes again and has the last word.
    if (!(PHOTO_TYPES as readonly string[]).includes(file.type)) return setProblem(`${file.name} is not a JPEG, PNG or WebP photo.`);
    if (file.size > PHOTO_MAX_BYTES) return setProblem(`${file.name} is larger than 8 MB; send a smaller copy.`);
    upload.mutate(
      { id: bookingId, file, caption: caption.trim() || undefined },
      {
        onSuccess: () => {
          setCaption('');
          if (fileInput.current) fileInput.current.value = '';
        },
      },
    );
  };

  return (
    <Stack gap={2}>
      {photos.length === 0 ? (
        <Typography level="body-sm">
          No photos yet. A picture of your pedals and your power supply helps the builder plan the layout.
        </Typography>
      ) : (
        <Box sx={{ display: 'grid', gridTemplateColumns: 'repeat(auto-fill, minmax(140px, 1fr))', gap: 1.5 }}>
          {photos.map((photo) => (
            <Box component="figure" key={photo.id} sx={{ m: 0 }}>
              <Link
                href={photo.url}
                target="_blank"
                rel="noopener"
                aria-label={`Open photo: ${photo.caption || kindWords[photo.kind]}`}
                sx={{ display: 'block' }}
              >
                <Box
                  component="img"
                  src={photo.thumbnailUrl}
                  alt={photo.caption || kindWords[photo.kind]}
                  loading="lazy"
                  sx={{
                    width: '100%',
                    aspectRatio: '4 / 3',
                    objectFit: 'cover',
                    borderRadius: 'sm',
                    border: '1px solid',
                    borderColor: 'neutral.outlinedBorder',
                  }}
                />
              </Link>
              <Typography component="figcaption" level="body-xs">
                {photo.caption || kindWords[photo.kind]}
              </Typography>
            </Box>
          ))}
        </Box>
      )}
      {full ? (
        <Typography level="body-sm">This build has {PHOTO_MAX_PER_BOOKING} photos, the most it can hold.</Typography>
      ) : (
        <Stack direction={{ xs: 'column', sm: 'row' }} gap={1} alignItems={{ sm: 'flex-end' }}>
          <Input
            placeholder="Caption (optional), e.g. power supply, underside"
            value={caption}
            onChange={(e) => setCaption(e.target.value)}
            sx={{ flex: 1 }}
            slotProps={{ input: { 'aria-label': 'Photo caption', maxLength: 200 } }}
          />
          <input
            ref={fileInput}
            type="file"
            accept={PHOTO_TYPES.join(',')}
            hidden
            onChange={(e) => send(e.target.files?.[0])}
            aria-label="Choose a photo"
          />
          <Button variant="outlined" loading={upload.isPending} onClick={() => fileInput.current?.click()}>
            Add a photo
          </Button>
        </Stack>
      )}
      <Typography level="body-xs">
        JPEG, PNG or WebP, up to 8 MB each, {PHOTO_MAX_PER_BOOKING} per build. Only you and the shop can see them; the camera's location and
        settings are removed from every copy.
      </Typography>
      {(problem || upload.error) && (
        <Alert color="danger" role="alert">
          {problem ?? upload.error?.message}
        </Alert>
      )}
    </Stack>
  );
}
