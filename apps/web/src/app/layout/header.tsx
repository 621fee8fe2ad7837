import {
  Box,
  Button,
  CloseButton,
  Drawer,
  HStack,
  IconButton,
  Link,
  Portal,
  Spacer,
} from '@chakra-ui/react';
import { Menu as MenuIcon } from 'lucide-react';
import { useState } from 'react';
import { Link as RouterLink, useLocation } from 'react-router-dom';
import { ColorModeButton } from '@/components/ui/color-mode';
import { UserMenu } from '@/features/session/components/user-menu';
import { useSession } from '@/features/session/hooks';
import { paths, signInHref } from '@/lib/paths';
import { Logo } from './logo';
import { MainNav } from './main-nav';

// Wide enough for all eight screens beside the logo and the account menu.
const WIDE = 'xl';

function SessionArea() {
  const { session, isPending } = useSession();
  const location = useLocation();
  if (isPending) return null;
  if (session) return <UserMenu session={session} />;
  return (
    <Button asChild size="sm" variant="solid">
      <RouterLink to={signInHref(`${location.pathname}${location.search}`)}>Sign in</RouterLink>
    </Button>
  );
}

function NavDrawer() {
  const [open, setOpen] = useState(false);
  return (
    <Drawer.Root
      open={open}
      onOpenChange={(event) => setOpen(event.open)}
      placement="start"
      lazyMount
      unmountOnExit
    >
      <Drawer.Trigger asChild>
        <IconButton variant="ghost" size="sm" aria-label="Open navigation" hideFrom={WIDE}>
          <MenuIcon aria-hidden />
        </IconButton>
      </Drawer.Trigger>
      <Portal>
        <Drawer.Backdrop />
        <Drawer.Positioner>
          <Drawer.Content maxW="xs">
            <Drawer.Header>
              <Drawer.Title>
                <Logo />
              </Drawer.Title>
            </Drawer.Header>
            <Drawer.Body>
              <MainNav orientation="vertical" onNavigate={() => setOpen(false)} />
            </Drawer.Body>
            <Drawer.CloseTrigger asChild>
              <CloseButton size="sm" aria-label="Close navigation" />
            </Drawer.CloseTrigger>
          </Drawer.Content>
        </Drawer.Positioner>
      </Portal>
    </Drawer.Root>
  );
}

/**
 * The header is always night-sky: it is forced into the dark scheme (`className="dark"`), so
 * every Chakra part in it takes its dark-mode colours whatever mode the page is in.
 */
export function Header() {
  return (
    <Box
      as="header"
      className="chakra-theme dark"
      colorScheme="dark"
      // Re-declared so the palette's variables resolve inside the dark scope, not at <html>.
      colorPalette="brand"
      bg="header.bg"
      color="fg"
      borderBottomWidth="1px"
      borderColor="header.border"
    >
      <HStack maxW="7xl" mx="auto" px={{ base: '3', md: '6' }} py="2" gap={{ base: '2', md: '4' }}>
        <NavDrawer />
        <Link
          asChild
          color="fg"
          textDecoration="none"
          rounded="md"
          _hover={{ textDecoration: 'none' }}
        >
          <RouterLink to={paths.desk}>
            <Logo />
          </RouterLink>
        </Link>
        <Box hideBelow={WIDE} ms="6">
          <MainNav orientation="horizontal" />
        </Box>
        <Spacer />
        <ColorModeButton />
        <SessionArea />
      </HStack>
    </Box>
  );
}
