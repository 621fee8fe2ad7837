import { EmptyState } from '@chakra-ui/react';
import { defineRoute } from '@/lib/route-module';

/** Placeholder until the screen lands: the route, its guard and its chunk already exist. */
function PendingScreen() {
  return (
    <EmptyState.Root>
      <EmptyState.Content>
        <EmptyState.Title>This screen is on its way</EmptyState.Title>
      </EmptyState.Content>
    </EmptyState.Root>
  );
}

export const route = defineRoute({ Component: PendingScreen });
