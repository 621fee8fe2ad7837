import { Heading, Link, List, Stack, Text } from '@chakra-ui/react';
import { ArrowRight } from 'lucide-react';
import { Link as RouterLink } from 'react-router-dom';
import { LoadError } from '@/components/ui/load-error';
import { BlockLoader } from '@/components/ui/loading';
import { StatusIndicator } from '@/components/ui/status-indicator';
import type { CheckItem, CheckLevel, Proposal } from '../api';
import { checkHref } from '../focus';
import { useChecks } from '../hooks';
import { LEVEL_PLURALS, sectionLabel } from '../labels';
import { OBSERVATION_FIELD_LABELS, observationFieldOf } from '../observation-preview';
import { OVERVIEW_LABELS } from './overview-section';
import { Finding } from './findings-list';

const LEVELS: CheckLevel[] = ['blocker', 'warning', 'note'];

const MEANING: Record<CheckLevel, string> = {
  blocker: 'These stop the submission until they are cleared.',
  warning: 'Worth a second look; they do not stop the submission.',
  note: 'For information.',
};

/** Where a finding's link goes, in words: "Observations › Bandwidth (MHz) of NGC 9001". */
function placeOf(item: CheckItem, proposal: Proposal): string {
  const section = sectionLabel(item.section);
  const field =
    item.section === 'overview'
      ? OVERVIEW_LABELS[item.field as keyof typeof OVERVIEW_LABELS]
      : item.section === 'observations'
        ? (() => {
            const name = observationFieldOf(item.field);
            return name ? OBSERVATION_FIELD_LABELS[name] : undefined;
          })()
        : undefined;
  const observation = proposal.observations.find((o) => o.id === item.observationId);
  const targetId = observation?.targetId ?? item.targetId;
  const target = proposal.targets.find((t) => t.id === targetId);
  const of = target ? ` of ${target.name}` : '';
  return field ? `${section} › ${field}${of}` : `${section}${of}`;
}

/** Every finding of the server's validation, by level, each linking to what it is about. */
export function ChecksSection({ proposal }: { proposal: Proposal }) {
  const checks = useChecks(proposal.reference);
  if (checks.isPending) return <BlockLoader label="Loading the checks" lines={4} />;
  if (checks.isError)
    return (
      <LoadError error={checks.error} what="the checks" onRetry={() => void checks.refetch()} />
    );
  const { items } = checks.data;
  if (items.length === 0) {
    return (
      <StatusIndicator tone="success" role="status">
        No blockers, warnings or notes: the proposal passes every check.
      </StatusIndicator>
    );
  }
  return (
    <Stack gap="8">
      {LEVELS.map((level) => {
        const group = items.filter((item) => item.level === level);
        const headingId = `checks-${level}`;
        return (
          <Stack as="section" key={level} aria-labelledby={headingId} gap="3">
            <Heading as="h3" size="md" id={headingId}>
              {LEVEL_PLURALS[level]} ({group.length})
            </Heading>
            <Text fontSize="sm" color="fg.muted">
              {group.length === 0 ? `No ${LEVEL_PLURALS[level].toLowerCase()}.` : MEANING[level]}
            </Text>
            {group.length > 0 && (
              <List.Root as="ul" listStyle="none" ps="0" gap="2">
                {group.map((item, index) => (
                  <Finding
                    key={`${item.code}-${item.field}-${index}`}
                    level={item.level}
                    message={item.message}
                    code={item.code}
                  >
                    <Link asChild mt="1" fontSize="sm">
                      <RouterLink to={checkHref(proposal.reference, item)}>
                        Go to {placeOf(item, proposal)} <ArrowRight aria-hidden size="14" />
                      </RouterLink>
                    </Link>
                  </Finding>
                ))}
              </List.Root>
            )}
          </Stack>
        );
      })}
    </Stack>
  );
}
