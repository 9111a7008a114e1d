import Box from '@mui/joy/Box';
import Typography from '@mui/joy/Typography';
import type { CustomerSummary } from '@loomwright/shared';
import { useState } from 'react';
import { DataTable, queryRows, type Column } from 'src/components/DataTable';
import { ErrorNote } from 'src/components/ErrorNote';
import { Notice } from 'src/components/Notice';
import { FilterBar } from 'src/components/FilterBar';
import { PageHeader } from 'src/components/PageHeader';
import { ExportCsvButton } from 'src/features/exports/components/ExportCsvButton';
import { PageLoading } from 'src/components/PageLoading';
import { SearchField } from 'src/components/SearchField';
import { SidePanel } from 'src/components/SidePanel';
import { useMe } from 'src/features/auth/api/get-me';
import { useCustomer } from 'src/features/customers/api/get-customer';
import { useCustomers, type CustomerSort } from 'src/features/customers/api/list-customers';
import { CustomerDetails } from 'src/features/customers/components/CustomerDetails';
import { SignOutEverywhere } from 'src/features/sessions/components/SignOutEverywhere';
import { formatDay } from 'src/lib/format';
import { pageQuery, useListParams } from 'src/lib/use-list-params';

const columns: Column<CustomerSummary>[] = [
  { id: 'name', header: 'Name', sortKey: 'name', render: (c) => <strong>{c.name}</strong> },
  {
    id: 'email',
    header: 'E-mail',
    sortKey: 'email',
    render: (c) => c.email ?? <Typography level="body-xs">Not one of your builds</Typography>,
  },
  { id: 'phone', header: 'Phone', width: 140, render: (c) => c.phone ?? '—' },
  { id: 'builds', header: 'Builds', sortKey: 'buildCount', firstOrder: 'desc', align: 'right', width: 80, render: (c) => c.buildCount },
  { id: 'active', header: 'In progress', align: 'right', width: 100, render: (c) => c.activeBuildCount },
  {
    id: 'last',
    header: 'Last request',
    sortKey: 'lastBookingAt',
    firstOrder: 'desc',
    width: 120,
    render: (c) => formatDay(c.lastBookingAt?.slice(0, 10)),
  },
  {
    id: 'since',
    header: 'Customer since',
    sortKey: 'createdAt',
    firstOrder: 'desc',
    width: 130,
    render: (c) => formatDay(c.createdAt.slice(0, 10)),
  },
];

export function Component() {
  const { params, update, paging, filter } = useListParams({ sort: 'name', order: 'asc', filters: { q: '', open: '' } });
  const list = useCustomers({
    ...pageQuery<CustomerSort>(params),
    search: params.filters.q || undefined,
  });
  const openId = params.filters.open || null;
  const detail = useCustomer(openId);
  const isOwner = useMe().data?.role === 'owner';
  const [notice, setNotice] = useState<string | null>(null);
  return (
    <>
      <PageHeader
        title="Customers"
        hint={
          isOwner
            ? 'Every player with an account, with their builds, payments and the messages the shop sent them.'
            : 'Every player with an account. You see the e-mail and phone of the players whose builds are yours; the owner sees all.'
        }
        actions={<ExportCsvButton kinds={['bookings', 'payments']} />}
      />
      <FilterBar label="Filter customers">
        <SearchField label="Search" placeholder={isOwner ? 'Name or e-mail' : 'Name'} {...filter('q')} />
      </FilterBar>
      <DataTable
        label="Customers"
        columns={isOwner ? columns : columns.map((c) => (c.id === 'email' ? { ...c, sortKey: undefined } : c))}
        {...queryRows(list)}
        {...paging}
        getRowId={(c) => c.id}
        onOpen={(c) => update({ filters: { open: c.id }, page: params.page })}
        selectedId={openId}
        emptyText="No customers match this search."
      />
      <SidePanel
        open={Boolean(openId)}
        onClose={() => update({ filters: { open: '' }, page: params.page })}
        title={detail.data?.name ?? 'Customer'}
      >
        {detail.isPending && <PageLoading />}
        <ErrorNote error={detail.error} />
        {detail.data && <CustomerDetails customer={detail.data} />}
        {detail.data && isOwner && (
          <Box sx={{ mt: 2 }}>
            <SignOutEverywhere userId={detail.data.id} name={detail.data.name} onDone={setNotice} />
          </Box>
        )}
      </SidePanel>
      <Notice message={notice} onClose={() => setNotice(null)} />
    </>
  );
}
