import { Box, HStack, Stack, Table, Text } from '@chakra-ui/react';
import type { Plan } from '../api';
import { hoursText } from '../labels';

/**
 * Per LST hour: granted hours (spread over each target's window) and planned hours against what
 * the period can hold. Bars for the eye, the numbers in the same cells for everyone.
 */
export function LstPressure({ plan }: { plan: Plan }) {
  const max = Math.max(1, ...plan.lstPressure.map((b) => Math.max(b.granted, b.capacity)));
  return (
    <Table.ScrollArea
      borderWidth="1px"
      rounded="md"
      maxH="28rem"
      tabIndex={0}
      aria-label="LST pressure, scrollable"
    >
      <Table.Root size="sm">
        <Table.Caption srOnly>LST pressure of the plan’s period</Table.Caption>
        <Table.Header>
          <Table.Row>
            <Table.ColumnHeader>LST hour</Table.ColumnHeader>
            <Table.ColumnHeader>Granted / planned / capacity</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {plan.lstPressure.map((b) => {
            const over = b.granted > b.capacity + 1e-6;
            return (
              <Table.Row key={b.lstHour}>
                <Table.Cell fontFamily="mono">{String(b.lstHour).padStart(2, '0')}h</Table.Cell>
                <Table.Cell minW="18rem">
                  <Stack gap="1">
                    <Box position="relative" h="3" bg="bg.muted" rounded="sm" aria-hidden>
                      <Box
                        position="absolute"
                        insetY="0"
                        left="0"
                        w={`${(b.capacity / max) * 100}%`}
                        borderRightWidth="2px"
                        borderColor="fg.muted"
                      />
                      <Box
                        h="full"
                        w={`${(b.granted / max) * 100}%`}
                        bg={over ? 'blocker.solid' : 'note.solid'}
                        opacity={0.45}
                        rounded="sm"
                      />
                      <Box
                        position="absolute"
                        top="1"
                        h="1"
                        left="0"
                        w={`${(b.planned / max) * 100}%`}
                        bg="success.solid"
                      />
                    </Box>
                    <HStack gap="3" fontSize="xs" color="fg.muted">
                      <Text>granted {hoursText(b.granted)}</Text>
                      <Text>planned {hoursText(b.planned)}</Text>
                      <Text>capacity {hoursText(b.capacity)}</Text>
                      {over && <Text color="blocker.fg">over capacity</Text>}
                    </HStack>
                  </Stack>
                </Table.Cell>
              </Table.Row>
            );
          })}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
