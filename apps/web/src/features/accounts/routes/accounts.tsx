import { HStack, Input, InputGroup, NativeSelect, Stack, Tabs, Text } from '@chakra-ui/react';
import type { PaginationState } from '@tanstack/react-table';
import { ScrollText, Search, Users } from 'lucide-react';
import { useState } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import { FormField } from '@/components/ui/form-field';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { useSession } from '@/features/session/hooks';
import { defineRoute } from '@/lib/route-module';
import {
  type AccountFilters,
  accountListQueryOptions,
  type AccountSort,
  type AccountStatus,
  type GlobalRole,
} from '../api';
import { AccountsTable } from '../components/accounts-table';
import { AuditTable } from '../components/audit-table';
import { TablePager } from '../components/table-pager';
import { useAccounts, useAudit, useDebounced } from '../hooks';
import { ACTION_FILTERS, ROLE_LABELS, STATUS_LABELS } from '../labels';

const PAGE_SIZE = 25;
const FIRST_PAGE: AccountFilters = { sort: 'name', order: 'asc', page: 1, pageSize: PAGE_SIZE };

function People() {
  const { session } = useSession();
  const [search, setSearch] = useState('');
  const q = useDebounced(search.trim());
  const [role, setRole] = useState<GlobalRole | ''>('');
  const [status, setStatus] = useState<AccountStatus | ''>('');
  const [sort, setSort] = useState<{ id: AccountSort; desc: boolean }>({ id: 'name', desc: false });
  const [page, setPage] = useState(1);
  const filters: AccountFilters = {
    ...(q ? { q } : {}),
    ...(role ? { role } : {}),
    ...(status ? { status } : {}),
    sort: sort.id,
    order: sort.desc ? 'desc' : 'asc',
    page,
    pageSize: PAGE_SIZE,
  };
  const query = useAccounts(filters);
  const pagination: PaginationState = { pageIndex: page - 1, pageSize: PAGE_SIZE };

  return (
    <Stack gap="4">
      <HStack gap="4" align="end" wrap="wrap">
        <FormField label="Search" maxW="sm">
          <InputGroup startElement={<Search size="16" aria-hidden />}>
            <Input
              type="search"
              placeholder="Name, e-mail or institute"
              value={search}
              onChange={(event) => {
                setSearch(event.target.value);
                setPage(1);
              }}
            />
          </InputGroup>
        </FormField>
        <FormField label="Role" maxW="12rem">
          <NativeSelect.Root>
            <NativeSelect.Field
              value={role}
              onChange={(event) => {
                setRole(event.target.value as GlobalRole | '');
                setPage(1);
              }}
            >
              <option value="">Any role</option>
              {Object.entries(ROLE_LABELS).map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </FormField>
        <FormField label="State" maxW="14rem">
          <NativeSelect.Root>
            <NativeSelect.Field
              value={status}
              onChange={(event) => {
                setStatus(event.target.value as AccountStatus | '');
                setPage(1);
              }}
            >
              <option value="">Any state</option>
              {Object.entries(STATUS_LABELS).map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </FormField>
      </HStack>
      {query.isPending ? (
        <BlockLoader label="Loading the accounts" lines={6} />
      ) : query.isError ? (
        <Text role="alert">The accounts could not be loaded: {query.error.message}</Text>
      ) : query.data.total === 0 ? (
        <EmptyState icon={Users} title="No account matches" description="Try another search." />
      ) : (
        <>
          <AccountsTable
            accounts={query.data.items}
            total={query.data.total}
            sort={sort}
            onSortChange={(next) => {
              setSort(next);
              setPage(1);
            }}
            pagination={pagination}
            onPaginationChange={(next) => setPage(next.pageIndex + 1)}
            currentUserId={session?.id}
          />
          <TablePager
            page={page}
            pageCount={Math.ceil(query.data.total / PAGE_SIZE)}
            total={query.data.total}
            noun={query.data.total === 1 ? 'account' : 'accounts'}
            onPage={setPage}
            label="Pages of accounts"
          />
        </>
      )}
    </Stack>
  );
}

function AuditLog() {
  const [action, setAction] = useState('');
  const [page, setPage] = useState(1);
  const query = useAudit({ ...(action ? { action } : {}), page, pageSize: PAGE_SIZE });
  return (
    <Stack gap="4">
      <FormField label="Show" maxW="sm">
        <NativeSelect.Root>
          <NativeSelect.Field
            value={action}
            onChange={(event) => {
              setAction(event.target.value);
              setPage(1);
            }}
          >
            {ACTION_FILTERS.map((filter) => (
              <option key={filter.value} value={filter.value}>
                {filter.label}
              </option>
            ))}
          </NativeSelect.Field>
          <NativeSelect.Indicator />
        </NativeSelect.Root>
      </FormField>
      {query.isPending ? (
        <BlockLoader label="Loading the audit log" lines={6} />
      ) : query.isError ? (
        <Text role="alert">The audit log could not be loaded: {query.error.message}</Text>
      ) : query.data.total === 0 ? (
        <EmptyState icon={ScrollText} title="Nothing logged of this kind" />
      ) : (
        <>
          <AuditTable events={query.data.items} />
          <TablePager
            page={page}
            pageCount={Math.ceil(query.data.total / PAGE_SIZE)}
            total={query.data.total}
            noun={query.data.total === 1 ? 'entry' : 'entries'}
            onPage={setPage}
            label="Pages of the audit log"
          />
        </>
      )}
    </Stack>
  );
}

function AccountsPage() {
  return (
    <>
      <PageHeader
        title="Accounts"
        description="Who can sign in, with which roles; and what they did."
      />
      <Tabs.Root defaultValue="people" lazyMount>
        <Tabs.List>
          <Tabs.Trigger value="people">
            <Users aria-hidden />
            People
          </Tabs.Trigger>
          <Tabs.Trigger value="audit">
            <ScrollText aria-hidden />
            Audit log
          </Tabs.Trigger>
        </Tabs.List>
        <Tabs.Content value="people">
          <People />
        </Tabs.Content>
        <Tabs.Content value="audit">
          <AuditLog />
        </Tabs.Content>
      </Tabs.Root>
    </>
  );
}

export const route = defineRoute({
  Component: AccountsPage,
  loader: (queryClient) => () => queryClient.ensureQueryData(accountListQueryOptions(FIRST_PAGE)),
});
