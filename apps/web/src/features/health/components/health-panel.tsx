import { Box, Button, Card, DataList, Heading, Text } from '@chakra-ui/react';
import { BlockLoader } from '@/components/ui/loading';
import { StatusIndicator } from '@/components/ui/status-indicator';
import type { Health } from '../api';
import { useHealth } from '../hooks';

const part = (state: 'up' | 'down') =>
  state === 'up' ? (
    <StatusIndicator tone="success">Up</StatusIndicator>
  ) : (
    <StatusIndicator tone="blocker">Down</StatusIndicator>
  );

function HealthReport({ health }: { health: Health }) {
  return (
    <>
      {health.status === 'ok' ? (
        <StatusIndicator tone="success">All systems working</StatusIndicator>
      ) : (
        <StatusIndicator tone="warning">Degraded: some parts are down</StatusIndicator>
      )}
      <DataList.Root orientation="horizontal" mt="4" gap="2">
        <DataList.Item>
          <DataList.ItemLabel>Database</DataList.ItemLabel>
          <DataList.ItemValue>{part(health.database)}</DataList.ItemValue>
        </DataList.Item>
        <DataList.Item>
          <DataList.ItemLabel>Mail</DataList.ItemLabel>
          <DataList.ItemValue>{part(health.mail)}</DataList.ItemValue>
        </DataList.Item>
        <DataList.Item>
          <DataList.ItemLabel>Version</DataList.ItemLabel>
          <DataList.ItemValue fontFamily="mono">{health.version}</DataList.ItemValue>
        </DataList.Item>
      </DataList.Root>
    </>
  );
}

/** The API's own report on itself: whether it, its database and its mail are working. */
export function HealthPanel() {
  const health = useHealth();
  return (
    <Card.Root variant="outline" as="section" aria-labelledby="health-heading">
      <Card.Body>
        <Heading as="h2" size="md" id="health-heading" mb="3">
          System status
        </Heading>
        <Box aria-live="polite">
          {health.isPending ? (
            <BlockLoader label="Checking the system status" />
          ) : health.isError ? (
            // An older good report is not shown once the server stops answering.
            <>
              <StatusIndicator tone="blocker">
                Unreachable: the server did not answer
              </StatusIndicator>
              <Text color="fg.muted" mt="2" textStyle="sm">
                {health.error.message}
              </Text>
              <Button
                size="sm"
                variant="outline"
                mt="3"
                onClick={() => void health.refetch()}
                loading={health.isFetching}
              >
                Check again
              </Button>
            </>
          ) : (
            <HealthReport health={health.data} />
          )}
        </Box>
      </Card.Body>
    </Card.Root>
  );
}
