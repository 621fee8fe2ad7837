import { Button, Card, Heading, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { Link as RouterLink, useLocation } from 'react-router-dom';
import { Inbox } from 'lucide-react';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import {
  AdminSection,
  ChairSection,
  ProposerSection,
  RefereeSection,
  StaffSection,
} from '@/features/desk/components/desk-sections';
import { useDesk, useNow } from '@/features/desk/hooks';
import { healthQueryOptions } from '@/features/health/api';
import { HealthPanel } from '@/features/health/components/health-panel';
import type { Session } from '@/features/session/api';
import { useSession } from '@/features/session/hooks';
import { paths, signInHref } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';

function Welcome() {
  const location = useLocation();
  return (
    <Card.Root variant="subtle" as="section" aria-labelledby="welcome-heading">
      <Card.Body>
        <Stack gap="3">
          <Heading as="h2" size="lg" id="welcome-heading">
            Welcome to Skyhours
          </Heading>
          <Text>
            Skyhours is where the observatory runs its calls for proposals: apply for observing time
            on the array, review proposals, rank them and allocate hours, and plan the observing.
          </Text>
          <Text color="fg.muted">
            You can read the open calls and try the calculator without an account. Sign in to write
            a proposal or to see what waits for you.
          </Text>
          <Stack direction={{ base: 'column', sm: 'row' }} gap="3" pt="1">
            <Button asChild>
              <RouterLink to={signInHref(location.pathname)}>Sign in</RouterLink>
            </Button>
            <Button asChild variant="outline">
              <RouterLink to={paths.calls}>See the calls</RouterLink>
            </Button>
          </Stack>
        </Stack>
      </Card.Body>
    </Card.Root>
  );
}

function Greeting({ session }: { session: Session }) {
  const desk = useDesk(true);
  const now = useNow();
  const data = desk.data;
  const empty =
    data && !data.proposer && !data.referee && !data.chair && !data.staff && !data.admin;
  return (
    <Stack gap="6">
      <Heading as="h2" size="lg" id="greeting-heading">
        Welcome back, {session.name}
      </Heading>
      {desk.isPending ? (
        <BlockLoader label="Loading your Desk" />
      ) : desk.isError ? (
        <LoadError error={desk.error} what="your Desk" onRetry={() => void desk.refetch()} />
      ) : empty ? (
        <EmptyState
          icon={Inbox}
          title="Nothing waits for you"
          description="Verify your e-mail address to write proposals; roles in a call appear here once granted."
        />
      ) : (
        <>
          {data?.chair && <ChairSection desk={data.chair} now={now} />}
          {data?.referee && <RefereeSection desk={data.referee} now={now} />}
          {data?.staff && <StaffSection desk={data.staff} now={now} />}
          {data?.admin && <AdminSection desk={data.admin} />}
          {data?.proposer && <ProposerSection desk={data.proposer} now={now} />}
        </>
      )}
    </Stack>
  );
}

/** Each role's start page: what waits for the signed-in user, by role, and the system's status. */
function DeskPage() {
  const { session, isPending } = useSession();
  return (
    <>
      <PageHeader title="Desk" />
      <SimpleGrid columns={{ base: 1, lg: 3 }} gap="6" alignItems="start">
        <Stack gridColumn={{ lg: 'span 2' }}>
          {isPending ? null : session ? <Greeting session={session} /> : <Welcome />}
        </Stack>
        <HealthPanel />
      </SimpleGrid>
    </>
  );
}

export const route = defineRoute({
  Component: DeskPage,
  // Start the health check with the navigation but do not wait for it: the Desk must open
  // even when the API is down, and the panel shows that itself.
  loader: (queryClient) => () => {
    void queryClient.prefetchQuery(healthQueryOptions());
    return null;
  },
});
