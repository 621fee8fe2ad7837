import { Button, Menu, Portal } from '@chakra-ui/react';
import { ChevronDown, LogOut, User } from 'lucide-react';
import { Link as RouterLink } from 'react-router-dom';
import { toaster } from '@/components/ui/toaster';
import { paths } from '@/lib/paths';
import type { Session } from '../api';
import { useSignOut } from '../hooks';

/** The signed-in user's name in the header, opening Profile and Sign out. */
export function UserMenu({ session }: { session: Session }) {
  const signOut = useSignOut();
  return (
    <Menu.Root positioning={{ placement: 'bottom-end' }}>
      <Menu.Trigger asChild>
        <Button
          variant="ghost"
          size="sm"
          maxW={{ base: '9rem', md: '16rem' }}
          aria-label={`Account menu for ${session.name}`}
        >
          <User aria-hidden />
          {/* A long name is cut with an ellipsis rather than widening a narrow page. */}
          <span style={{ overflow: 'hidden', textOverflow: 'ellipsis', whiteSpace: 'nowrap' }}>
            {session.name}
          </span>
          <ChevronDown aria-hidden />
        </Button>
      </Menu.Trigger>
      <Portal>
        <Menu.Positioner>
          <Menu.Content minW="12rem">
            <Menu.ItemGroup>
              <Menu.ItemGroupLabel color="fg.muted" fontWeight="normal">
                {session.email}
              </Menu.ItemGroupLabel>
              <Menu.Item value="profile" asChild>
                <RouterLink to={paths.profile}>
                  <User aria-hidden />
                  Profile
                </RouterLink>
              </Menu.Item>
              <Menu.Item
                value="sign-out"
                disabled={signOut.isPending}
                onSelect={() =>
                  signOut.mutate(undefined, {
                    onError: () =>
                      toaster.create({
                        type: 'error',
                        title: 'Could not sign out. Please try again.',
                      }),
                  })
                }
              >
                <LogOut aria-hidden />
                Sign out
              </Menu.Item>
            </Menu.ItemGroup>
          </Menu.Content>
        </Menu.Positioner>
      </Portal>
    </Menu.Root>
  );
}
