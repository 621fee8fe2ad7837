import { Button, Stack } from '@chakra-ui/react';
import { CircleAlert, Lock } from 'lucide-react';
import {
  Link as RouterLink,
  isRouteErrorResponse,
  useRevalidator,
  useRouteError,
} from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import type { Audience } from '@/features/session/access';
import { isApiError } from '@/lib/api-client';
import { paths } from '@/lib/paths';
import type { ForbiddenData } from '../lazy-route';
import { NotFoundPage } from './not-found';

const audienceNames: Record<Audience, string> = {
  everyone: 'everyone',
  'signed-in': 'signed-in users',
  proposer: 'proposers',
  referee: 'referees',
  chair: 'committee chairs',
  staff: 'observatory staff',
  admin: 'administrators',
};

const deskLink = (
  <Button asChild variant="outline">
    <RouterLink to={paths.desk}>Go to the Desk</RouterLink>
  </Button>
);

function Forbidden({ audience }: { audience?: Audience }) {
  return (
    <>
      <PageHeader title="Not available to you" />
      <EmptyState
        icon={Lock}
        title="This screen is not open to your account"
        description={
          audience
            ? `It is for ${audienceNames[audience]}.`
            : 'Your account lacks the role it needs.'
        }
        action={deskLink}
      />
    </>
  );
}

/**
 * The router's `errorElement`: what a screen shows when its code, its data or its rendering
 * failed. "Try again" reloads the data for a failed request; for anything else (a chunk that
 * did not load, a fault in the page) only a fresh page load can help.
 */
export function RouteError() {
  const error = useRouteError();
  const revalidator = useRevalidator();

  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundPage />;
  if (isRouteErrorResponse(error) && error.status === 403) {
    return <Forbidden audience={(error.data as ForbiddenData | undefined)?.audience} />;
  }
  if (isApiError(error, 403)) return <Forbidden />;
  if (isApiError(error, 404)) return <NotFoundPage />;

  const dataFailed = isApiError(error);
  const message = dataFailed
    ? error.message
    : 'Part of this page failed to load or to run. Loading it again usually helps.';

  return (
    <>
      <PageHeader title="Something went wrong" />
      <EmptyState
        icon={CircleAlert}
        title="This screen could not be shown"
        description={message}
        action={
          <Stack direction={{ base: 'column', sm: 'row' }} gap="3">
            <Button
              loading={revalidator.state === 'loading'}
              onClick={() =>
                dataFailed ? void revalidator.revalidate() : window.location.reload()
              }
            >
              Try again
            </Button>
            {deskLink}
          </Stack>
        }
      />
    </>
  );
}
