import { Box, HStack, Text } from '@chakra-ui/react';
import { useHealth } from '@/features/health/hooks';
import { viewerTimeZone } from '@/lib/time';

export function Footer() {
  const { data: health } = useHealth();
  return (
    <Box as="footer" borderTopWidth="1px" mt="auto">
      <HStack
        maxW="7xl"
        mx="auto"
        px={{ base: '3', md: '6' }}
        py="4"
        justify="space-between"
        wrap="wrap"
        gap="2"
        color="fg.muted"
        textStyle="sm"
      >
        <Text>
          Skyhours{' '}
          <Text as="span" fontFamily="mono">
            {health ? `version ${health.version}` : 'version unknown'}
          </Text>
        </Text>
        <Text>Times are shown in your zone ({viewerTimeZone()}) and in UTC.</Text>
      </HStack>
    </Box>
  );
}
