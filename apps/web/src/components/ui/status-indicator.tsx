import { HStack, Icon, Text, type StackProps } from '@chakra-ui/react';
import { CircleCheck, Info, OctagonX, TriangleAlert, type LucideIcon } from 'lucide-react';
import type { ReactNode } from 'react';

/** The four signal levels; also the names of their colour palettes in the theme. */
export type Tone = 'blocker' | 'warning' | 'note' | 'success';

// Each tone has its own shape as well as its colour, so it reads in grey scale and to
// people who do not tell the colours apart.
const icons: Record<Tone, LucideIcon> = {
  blocker: OctagonX,
  warning: TriangleAlert,
  note: Info,
  success: CircleCheck,
};

export interface StatusIndicatorProps extends Omit<StackProps, 'children'> {
  tone: Tone;
  /** The words that say the state; required, because colour and icon alone are not enough. */
  children: ReactNode;
}

/** An icon and words in a tone's colour: the way Skyhours shows a state. */
export function StatusIndicator({ tone, children, ...rest }: StatusIndicatorProps) {
  return (
    <HStack gap="1.5" colorPalette={tone} color="colorPalette.fg" data-tone={tone} {...rest}>
      <Icon as={icons[tone]} boxSize="1.1em" aria-hidden flexShrink={0} />
      <Text as="span" fontWeight="medium">
        {children}
      </Text>
    </HStack>
  );
}
