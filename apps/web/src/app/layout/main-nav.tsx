import { Icon, Link, Stack } from '@chakra-ui/react';
import { NavLink } from 'react-router-dom';
import { useSession } from '@/features/session/hooks';
import { paths } from '@/lib/paths';
import { visibleNavItems } from '../nav';

export interface MainNavProps {
  orientation: 'horizontal' | 'vertical';
  /** Called after a link is followed, e.g. to close the drawer it sits in. */
  onNavigate?: () => void;
}

/** The screens this user may use. The current one is marked in words and weight, not only colour. */
export function MainNav({ orientation, onNavigate }: MainNavProps) {
  const { session } = useSession();
  const horizontal = orientation === 'horizontal';
  return (
    <nav aria-label="Main">
      <Stack as="ul" listStyle="none" direction={horizontal ? 'row' : 'column'} gap="0.5">
        {visibleNavItems(session).map((item) => (
          <li key={item.to}>
            <Link
              asChild
              display="flex"
              alignItems="center"
              gap="2"
              px={horizontal ? '2' : '2.5'}
              py={horizontal ? '1.5' : '2.5'}
              rounded="md"
              color="fg.muted"
              fontWeight="medium"
              textDecoration="none"
              borderBottomWidth={horizontal ? '2px' : undefined}
              borderStartWidth={horizontal ? undefined : '3px'}
              borderColor="transparent"
              _hover={{ color: 'fg', bg: 'bg.emphasized/50' }}
              _currentPage={{ color: 'fg', fontWeight: 'semibold', borderColor: 'brand.focusRing' }}
            >
              <NavLink to={item.to} end={item.to === paths.desk} onClick={onNavigate}>
                {/* The bar has room for words only; the drawer shows the icons too. */}
                {!horizontal && <Icon as={item.icon} boxSize="4" aria-hidden />}
                {item.label}
              </NavLink>
            </Link>
          </li>
        ))}
      </Stack>
    </nav>
  );
}
