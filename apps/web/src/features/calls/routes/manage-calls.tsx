import { Button, HStack, NativeSelect, Stack } from '@chakra-ui/react';
import { Megaphone, Plus } from 'lucide-react';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { FormField } from '@/components/ui/form-field';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';
import { CALL_STATUSES, type CallStatus } from '../api';
import { CallsTable } from '../components/calls-table';
import { Pager } from '../components/pager';
import { QueryError } from '../components/query-error';
import { useCalls } from '../hooks';
import { STATUS_LABELS } from '../labels';

const PAGE_SIZE = 20;

/** Staff: every call, planned ones included, filtered by status. */
function ManageCallsPage() {
  const [status, setStatus] = useState<CallStatus | ''>('');
  const [page, setPage] = useState(1);
  const query = useCalls({ status: status ? [status] : undefined, page, pageSize: PAGE_SIZE });
  return (
    <>
      <PageHeader
        title="Calls for proposals"
        description="Create calls, open them and move them along their lifecycle."
        actions={
          <Button asChild>
            <RouterLink to={paths.newCall}>
              <Plus aria-hidden /> New call
            </RouterLink>
          </Button>
        }
      />
      <Stack gap="4">
        <HStack>
          <FormField label="Status" maxW="xs">
            <NativeSelect.Root size="sm">
              <NativeSelect.Field
                value={status}
                onChange={(event) => {
                  setStatus(event.target.value as CallStatus | '');
                  setPage(1);
                }}
              >
                <option value="">Every status</option>
                {CALL_STATUSES.map((s) => (
                  <option key={s} value={s}>
                    {STATUS_LABELS[s]}
                  </option>
                ))}
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
          </FormField>
        </HStack>
        {query.isPending ? (
          <BlockLoader label="Loading the calls" lines={5} />
        ) : query.isError ? (
          <QueryError error={query.error} onRetry={() => void query.refetch()} what="the calls" />
        ) : query.data.total === 0 ? (
          <EmptyState
            icon={Megaphone}
            title={status ? `No call is ${STATUS_LABELS[status].toLowerCase()}` : 'No calls yet'}
            description="A new call starts as planned, visible to staff only, until you open it."
          />
        ) : (
          <>
            <CallsTable calls={query.data.items} caption="Calls for proposals" />
            <Pager
              page={query.data.page}
              pageSize={query.data.pageSize}
              total={query.data.total}
              onPage={setPage}
              label="Pages of calls"
            />
          </>
        )}
      </Stack>
    </>
  );
}

export const route = defineRoute({ Component: ManageCallsPage });
