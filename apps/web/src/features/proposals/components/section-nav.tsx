import { Badge, Box, chakra, List } from '@chakra-ui/react';
import { Link as RouterLink } from 'react-router-dom';
import { proposalHref } from '@/lib/paths';
import { SECTIONS, type SectionId } from '../labels';

const NavLink = chakra(RouterLink);

/**
 * The editor's sections as links, so each has its own address and Back works; the current one
 * is marked for screen readers (aria-current) and by more than colour (weight and a bar).
 */
export function SectionNav({
  reference,
  current,
  blockers,
}: {
  reference: string;
  current: SectionId;
  /** Shown beside Checks, once known. */
  blockers: number | undefined;
}) {
  return (
    <Box as="nav" aria-label="Proposal sections">
      <List.Root
        as="ol"
        listStyle="none"
        ps="0"
        display="flex"
        flexDirection={{ base: 'row', md: 'column' }}
        gap="1"
        overflowX={{ base: 'auto', md: 'visible' }}
        pb={{ base: '2', md: '0' }}
      >
        {SECTIONS.map(({ id, label }) => {
          const active = id === current;
          return (
            <List.Item key={id} flexShrink={0}>
              <NavLink
                to={proposalHref(reference, id)}
                aria-current={active ? 'page' : undefined}
                // Holds the badge's hidden words, which would otherwise widen the page.
                position="relative"
                display="flex"
                alignItems="center"
                justifyContent="space-between"
                gap="2"
                px="3"
                py="2"
                rounded="l2"
                fontWeight={active ? 'semibold' : 'normal'}
                bg={active ? 'colorPalette.subtle' : undefined}
                color={active ? 'colorPalette.fg' : 'fg'}
                borderStartWidth={{ md: '3px' }}
                borderBottomWidth={{ base: '3px', md: '0' }}
                borderColor={active ? 'colorPalette.solid' : 'transparent'}
                _hover={{ bg: 'bg.muted' }}
                focusVisibleRing="outside"
              >
                {label}
                {id === 'checks' && blockers !== undefined && blockers > 0 && (
                  <Badge colorPalette="blocker" variant="solid" size="sm">
                    {blockers}
                    <Box as="span" srOnly>
                      {blockers === 1 ? ' blocker' : ' blockers'}
                    </Box>
                  </Badge>
                )}
              </NavLink>
            </List.Item>
          );
        })}
      </List.Root>
    </Box>
  );
}
