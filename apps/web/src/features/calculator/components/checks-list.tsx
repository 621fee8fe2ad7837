import { List, Stack, Text } from '@chakra-ui/react';
import type { Check, CheckLevel } from '@skyhours/calc';
import { StatusIndicator } from '@/components/ui/status-indicator';

const LEVEL_WORDS: Record<CheckLevel, string> = {
  blocker: 'Blocker',
  warning: 'Warning',
  note: 'Note',
};

/** What each level means for a proposal, said once under the list. */
const LEVEL_MEANING =
  'A blocker stops a proposal from being submitted; a warning asks you to look again; a note is for information.';

/**
 * The findings of the checks, blockers first. Each line says its level in words and with an
 * icon of its own shape, so the colour is never the only signal.
 */
export function ChecksList({
  checks,
  fieldLabel,
}: {
  checks: Check[];
  fieldLabel: (path: string) => string | null;
}) {
  if (checks.length === 0) {
    return (
      <StatusIndicator tone="success" role="status">
        No findings: this observation passes every check.
      </StatusIndicator>
    );
  }
  return (
    <Stack gap="3">
      <List.Root as="ul" listStyle="none" gap="3" ps="0">
        {checks.map((check) => {
          const about = fieldLabel(check.field);
          return (
            <List.Item
              key={check.code}
              display="block"
              colorPalette={check.level}
              bg="colorPalette.subtle"
              borderStartWidth="4px"
              borderColor="colorPalette.border"
              rounded="l2"
              px="3"
              py="2"
              data-check={check.code}
            >
              <StatusIndicator tone={check.level}>{LEVEL_WORDS[check.level]}</StatusIndicator>
              <Text mt="1">{check.message}</Text>
              {about && (
                <Text textStyle="xs" color="fg.muted" mt="1">
                  About: {about}
                </Text>
              )}
            </List.Item>
          );
        })}
      </List.Root>
      <Text textStyle="xs" color="fg.muted">
        {LEVEL_MEANING}
      </Text>
    </Stack>
  );
}
