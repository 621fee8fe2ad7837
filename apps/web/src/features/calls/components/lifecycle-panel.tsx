import { Box, Button, Card, Flex, Heading, HStack, Link, Stack, Text } from '@chakra-ui/react';
import { Check } from 'lucide-react';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { toaster } from '@/components/ui/toaster';
import { standingHref } from '@/lib/paths';
import { formatLocalAndUtc } from '@/lib/time';
import { type Call, CALL_STATUSES, type CallStatus } from '../api';
import { useTransitionCall } from '../hooks';
import { STATUS_LABELS, STATUS_MEANINGS } from '../labels';

function consequence(call: Call, to: CallStatus): string {
  if (to === 'open') {
    const opens = formatLocalAndUtc(call.opensAt);
    const deadline = formatLocalAndUtc(call.deadlineAt);
    return `Opening publishes ${call.code} to everyone. Proposals can be submitted from ${opens.local} (${opens.utc}) until the deadline, ${deadline.local} (${deadline.utc}).`;
  }
  return `${call.code} moves from ${STATUS_LABELS[call.status].toLowerCase()} to ${STATUS_LABELS[to].toLowerCase()}: ${STATUS_MEANINGS[to]}`;
}

/** Where the call is in its lifecycle, and the one step staff can take next. */
export function LifecyclePanel({ call }: { call: Call }) {
  const [open, setOpen] = useState(false);
  const transition = useTransitionCall(call.code);
  const next = call.nextStatus;
  const current = CALL_STATUSES.indexOf(call.status);

  const confirm = () => {
    if (!next) return;
    transition.mutate(next, {
      onSuccess: (moved) => {
        setOpen(false);
        toaster.create({
          type: 'success',
          title: `${moved.code} is now ${STATUS_LABELS[moved.status].toLowerCase()}`,
        });
      },
    });
  };

  return (
    <Card.Root as="section" aria-labelledby="lifecycle-heading" variant="outline">
      <Card.Body>
        <Stack gap="4">
          <Heading as="h2" size="md" id="lifecycle-heading">
            Lifecycle
          </Heading>
          <Flex as="ol" listStyleType="none" wrap="wrap" gap="2" m="0" p="0">
            {CALL_STATUSES.map((status, index) => {
              const done = index < current;
              const here = index === current;
              return (
                <Box
                  as="li"
                  key={status}
                  aria-current={here ? 'step' : undefined}
                  px="2.5"
                  py="1"
                  rounded="full"
                  borderWidth="1px"
                  fontSize="sm"
                  borderColor={here ? 'brand.solid' : 'border'}
                  bg={here ? 'brand.solid' : done ? 'brand.subtle' : 'transparent'}
                  color={here ? 'brand.contrast' : done ? 'brand.fg' : 'fg.muted'}
                  fontWeight={here ? 'semibold' : 'normal'}
                >
                  <HStack gap="1">
                    {done && <Check size="0.9em" aria-hidden />}
                    <Text as="span">
                      {index + 1}. {STATUS_LABELS[status]}
                    </Text>
                    {done && <Box srOnly>(done)</Box>}
                  </HStack>
                </Box>
              );
            })}
          </Flex>
          <Text color="fg.muted">{STATUS_MEANINGS[call.status]}</Text>
          {next === 'closed' ? (
            <Text>
              The call closes by itself at its deadline; move the deadline to close it sooner.
            </Text>
          ) : next === 'published' ? (
            <Text>
              The call&apos;s chair publishes the outcomes from the{' '}
              <Link asChild color="brand.fg" textDecoration="underline">
                <RouterLink to={standingHref(call.code)}>standing</RouterLink>
              </Link>
              , after deciding every proposal.
            </Text>
          ) : next ? (
            <HStack>
              <Button
                onClick={() => {
                  transition.reset();
                  setOpen(true);
                }}
              >
                {next === 'open' ? 'Open the call' : `Move to ${STATUS_LABELS[next].toLowerCase()}`}
              </Button>
            </HStack>
          ) : (
            <Text>The call has reached the end of its lifecycle.</Text>
          )}
        </Stack>
      </Card.Body>
      {next && next !== 'closed' && next !== 'published' && (
        <ConfirmDialog
          open={open}
          onOpenChange={setOpen}
          title={
            next === 'open'
              ? `Open ${call.code}?`
              : `Move ${call.code} to ${STATUS_LABELS[next].toLowerCase()}?`
          }
          confirmLabel={
            next === 'open' ? 'Open the call' : `Move to ${STATUS_LABELS[next].toLowerCase()}`
          }
          onConfirm={confirm}
          pending={transition.isPending}
          error={transition.error?.message}
        >
          <Text>{consequence(call, next)}</Text>
          <Text fontWeight="medium">A call never moves back: this cannot be undone.</Text>
        </ConfirmDialog>
      )}
    </Card.Root>
  );
}
