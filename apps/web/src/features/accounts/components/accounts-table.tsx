import { Badge, Box, HStack, Stack, Table, Text, chakra } from '@chakra-ui/react';
import {
  createColumnHelper,
  rowPaginationFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type PaginationState,
  type SortingState,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import { countryName } from '@/components/ui/country-select';
import { formatInstant } from '@/lib/time';
import type { Account, AccountSort } from '../api';
import { ROLE_LABELS } from '../labels';
import { AccountActions } from './account-actions';

const features = tableFeatures({ rowSortingFeature, rowPaginationFeature });
const helper = createColumnHelper<typeof features, Account>();

// Column ids are the server's sort keys, so the table's sorting state is the request's.
const columns = helper.columns([
  helper.accessor('name', {
    id: 'name',
    header: 'Name',
    cell: ({ row }) => (
      <Stack gap="0">
        <Text fontWeight="medium">{row.original.name}</Text>
        <Text fontSize="sm" color="fg.muted">
          {row.original.email}
        </Text>
      </Stack>
    ),
  }),
  helper.accessor('affiliation', {
    id: 'affiliation',
    header: 'Institute',
    cell: ({ row }) => (
      <Stack gap="0">
        <Text>{row.original.affiliation}</Text>
        <Text fontSize="sm" color="fg.muted">
          {countryName(row.original.country)}
        </Text>
      </Stack>
    ),
  }),
  helper.display({
    id: 'roles',
    header: 'Roles and state',
    enableSorting: false,
    cell: ({ row }) => {
      const { globalRoles, emailVerified, active } = row.original;
      return (
        <HStack gap="1" wrap="wrap">
          {globalRoles.map((role) => (
            <Badge key={role} variant="subtle">
              {ROLE_LABELS[role]}
            </Badge>
          ))}
          {emailVerified && active && <Badge variant="outline">Proposer</Badge>}
          {!emailVerified && (
            <Badge colorPalette="warning" variant="subtle">
              Address not confirmed
            </Badge>
          )}
          {!active && (
            <Badge colorPalette="blocker" variant="solid">
              Deactivated
            </Badge>
          )}
        </HStack>
      );
    },
  }),
  helper.accessor('lastSignInAt', {
    id: 'lastSignInAt',
    header: 'Last sign-in',
    cell: (info) => {
      const value = info.getValue();
      return value ? (
        <time dateTime={value}>{formatInstant(value)}</time>
      ) : (
        <Text color="fg.muted">never</Text>
      );
    },
  }),
]);

export interface AccountsTableProps {
  accounts: Account[];
  total: number;
  sort: { id: AccountSort; desc: boolean };
  onSortChange: (sort: { id: AccountSort; desc: boolean }) => void;
  /** 0-based, as the table counts */
  pagination: PaginationState;
  onPaginationChange: (pagination: PaginationState) => void;
  currentUserId: string | undefined;
}

function SortIcon({ sorted }: { sorted: false | 'asc' | 'desc' }) {
  const Icon = sorted === 'asc' ? ArrowUp : sorted === 'desc' ? ArrowDown : ArrowUpDown;
  return <Icon size="14" aria-hidden />;
}

/**
 * The Accounts list. Sorting and paging are manual: the table holds the state, the server sorts
 * and pages (through `onSortChange` and `onPaginationChange`).
 */
export function AccountsTable({
  accounts,
  total,
  sort,
  onSortChange,
  pagination,
  onPaginationChange,
  currentUserId,
}: AccountsTableProps) {
  const sorting: SortingState = [sort];
  const table = useTable({
    features,
    columns,
    data: accounts,
    getRowId: (account) => account.id,
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    rowCount: total,
    state: { sorting, pagination },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first) onSortChange({ id: first.id as AccountSort, desc: first.desc });
    },
    onPaginationChange: (updater) =>
      onPaginationChange(typeof updater === 'function' ? updater(pagination) : updater),
  });

  return (
    // Focusable so keyboard users can scroll a wide table (axe: scrollable-region-focusable).
    <Table.ScrollArea borderWidth="1px" rounded="md" tabIndex={0}>
      <Table.Root size="sm" interactive>
        <Table.Caption srOnly>Accounts</Table.Caption>
        <Table.Header>
          {table.getHeaderGroups().map((group) => (
            <Table.Row key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <Table.ColumnHeader
                    key={header.id}
                    aria-sort={
                      sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined
                    }
                  >
                    {header.column.getCanSort() ? (
                      <chakra.button
                        type="button"
                        display="inline-flex"
                        alignItems="center"
                        gap="1"
                        fontWeight="inherit"
                        onClick={header.column.getToggleSortingHandler()}
                      >
                        <table.FlexRender header={header} />
                        <SortIcon sorted={sorted} />
                      </chakra.button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </Table.ColumnHeader>
                );
              })}
              <Table.ColumnHeader>
                <Box srOnly>Actions</Box>
              </Table.ColumnHeader>
            </Table.Row>
          ))}
        </Table.Header>
        <Table.Body>
          {table.getRowModel().rows.map((row) => (
            <Table.Row key={row.id}>
              {row.getAllCells().map((cell) => (
                <Table.Cell key={cell.id}>
                  <table.FlexRender cell={cell} />
                </Table.Cell>
              ))}
              <Table.Cell textAlign="end">
                <AccountActions account={row.original} isSelf={row.original.id === currentUserId} />
              </Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
