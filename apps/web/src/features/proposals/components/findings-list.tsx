import { List, Text } from '@chakra-ui/react';
import type { Check } from '@skyhours/calc';
import type { ReactNode } from 'react';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { LEVEL_LABELS } from '../labels';

const ORDER = { blocker: 0, warning: 1, note: 2 } as const;

/** One finding: its level in words and by an icon of its own shape, then its sentence. */
export function Finding({
  level,
  message,
  children,
  code,
}: Pick<Check, 'level' | 'message'> & { code?: string; children?: ReactNode }) {
  return (
    <List.Item
      display="block"
      colorPalette={level}
      bg="colorPalette.subtle"
      borderStartWidth="4px"
      borderColor="colorPalette.solid"
      rounded="l2"
      px="3"
      py="2"
      data-check={code}
      data-level={level}
    >
      <StatusIndicator tone={level}>{LEVEL_LABELS[level]}</StatusIndicator>
      <Text mt="1" color="fg">
        {message}
      </Text>
      {children}
    </List.Item>
  );
}

/** An observation's checks, blockers first; says so plainly when there are none. */
export function FindingsList({ checks, empty }: { checks: Check[]; empty?: string }) {
  if (checks.length === 0) {
    return (
      <StatusIndicator tone="success">
        {empty ?? 'No findings: this observation passes every check.'}
      </StatusIndicator>
    );
  }
  const sorted = [...checks].sort((a, b) => ORDER[a.level] - ORDER[b.level]);
  return (
    <List.Root as="ul" listStyle="none" gap="2" ps="0">
      {sorted.map((check) => (
        <Finding key={`${check.code}-${check.field}`} {...check} />
      ))}
    </List.Root>
  );
}
