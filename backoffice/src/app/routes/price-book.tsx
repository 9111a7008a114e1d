import Box from '@mui/joy/Box';
import Card from '@mui/joy/Card';
import Table from '@mui/joy/Table';
import Typography from '@mui/joy/Typography';
import { useState } from 'react';
import { ErrorNote } from 'src/components/ErrorNote';
import { Notice } from 'src/components/Notice';
import { PageHeader } from 'src/components/PageHeader';
import { PageLoading } from 'src/components/PageLoading';
import { usePriceBook } from 'src/features/price-book/api/get-price-book';
import { PriceBookForm } from 'src/features/price-book/components/PriceBookForm';
import { useMe } from 'src/features/auth/api/get-me';
import { formatStamp } from 'src/lib/format';

export function Component() {
  const overview = usePriceBook();
  const me = useMe();
  const canEdit = me.data?.role === 'owner';
  const [notice, setNotice] = useState<string | null>(null);
  const data = overview.data;
  return (
    <>
      <PageHeader
        title="Price book"
        hint={canEdit ? 'Edit any number, then publish it as a new version.' : 'The current prices and rates. Only the owner changes them.'}
      />
      <ErrorNote error={overview.error} />
      {overview.isPending && <PageLoading />}
      {data && (
        <Box
          sx={{ display: 'grid', gridTemplateColumns: { xs: 'minmax(0, 1fr)', xl: 'minmax(0, 1fr) 300px' }, gap: 2, alignItems: 'start' }}
        >
          <PriceBookForm book={data.current.book} version={data.current.version} canEdit={canEdit} onPublished={setNotice} />
          <Card variant="outlined" sx={{ gap: 1 }}>
            <Typography level="title-md" component="h2">
              Versions
            </Typography>
            <Typography level="body-xs">Every quote names the version it was priced from.</Typography>
            <Table size="sm" aria-label="Price book versions" sx={{ '--TableCell-height': '28px' }}>
              <thead>
                <tr>
                  <th style={{ width: 44 }}>No.</th>
                  <th>Published</th>
                </tr>
              </thead>
              <tbody>
                {data.versions.map((v) => (
                  <tr key={v.version}>
                    <td>
                      <strong>{v.version}</strong>
                    </td>
                    <td>
                      {formatStamp(v.publishedAt)}
                      {v.version === data.current.version ? ' · current' : ''}
                      <Typography level="body-xs" sx={{ display: 'block' }}>
                        {[v.publishedBy, v.notes].filter(Boolean).join(' · ') || '—'}
                      </Typography>
                    </td>
                  </tr>
                ))}
              </tbody>
            </Table>
          </Card>
        </Box>
      )}
      <Notice message={notice} onClose={() => setNotice(null)} />
    </>
  );
}
