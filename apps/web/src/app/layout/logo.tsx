import { HStack, Image, Text } from '@chakra-ui/react';
import markUrl from '@/assets/skyhours-mark.svg';

/** The mark and the name; the name is text, so it is read out and found by search. */
export function Logo() {
  return (
    <HStack gap="2">
      <Image src={markUrl} alt="" boxSize="8" />
      <Text as="span" fontSize="lg" fontWeight="semibold" letterSpacing="-0.01em">
        Skyhours
      </Text>
    </HStack>
  );
}
