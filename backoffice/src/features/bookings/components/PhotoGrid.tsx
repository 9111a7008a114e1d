import AspectRatio from '@mui/joy/AspectRatio';
import Box from '@mui/joy/Box';
import Link from '@mui/joy/Link';
import Typography from '@mui/joy/Typography';
import type { PhotoView } from '@loomwright/shared';

const kindWords: Record<PhotoView['kind'], string> = {
  customer: 'From the player',
  intake: 'Intake',
  build: 'Build',
};

export function PhotoGrid({ photos }: { photos: PhotoView[] }) {
  if (photos.length === 0) return <Typography level="body-sm">No photos yet.</Typography>;
  return (
    <Box sx={{ display: 'grid', gridTemplateColumns: 'repeat(auto-fill, minmax(132px, 1fr))', gap: 1 }}>
      {photos.map((photo) => (
        <Box component="figure" key={photo.id} sx={{ m: 0 }}>
          <Link href={photo.url} target="_blank" rel="noopener" aria-label={`Open photo: ${photo.caption || kindWords[photo.kind]}`}>
            <AspectRatio ratio="4/3" sx={{ width: '100%', borderRadius: 'sm' }}>
              <img src={photo.thumbnailUrl} alt={photo.caption || `${kindWords[photo.kind]} photo`} loading="lazy" />
            </AspectRatio>
          </Link>
          <Typography component="figcaption" level="body-xs" sx={{ mt: 0.5 }}>
            {kindWords[photo.kind]}
            {photo.caption ? ` · ${photo.caption}` : ''}
          </Typography>
        </Box>
      ))}
    </Box>
  );
}
