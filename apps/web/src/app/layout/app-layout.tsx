import { Box, Flex, SkipNavContent, SkipNavLink } from '@chakra-ui/react';
import { useEffect, useRef } from 'react';
import { Outlet, ScrollRestoration, useLocation, useNavigation } from 'react-router-dom';
import { Footer } from './footer';
import { Header } from './header';

/** A thin bar under the header while the next screen (its code or its data) loads. */
function NavigationProgress() {
  const navigation = useNavigation();
  if (navigation.state === 'idle') return null;
  return (
    <Box
      role="progressbar"
      aria-label="Loading the next screen"
      position="fixed"
      top="0"
      insetX="0"
      h="3px"
      zIndex="banner"
      overflow="hidden"
    >
      <Box
        h="full"
        w="40%"
        bg="brand.solid"
        animation="skyhours-progress 1.1s ease-in-out infinite"
        _motionReduce={{ animation: 'none', w: 'full', opacity: 0.6 }}
      />
    </Box>
  );
}

/**
 * The frame of every screen. After each navigation, focus moves to the new screen's content,
 * so keyboard and screen-reader users start there rather than at the end of the old page.
 */
export function AppLayout() {
  const { pathname } = useLocation();
  const main = useRef<HTMLDivElement>(null);
  const firstRender = useRef(true);

  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      return;
    }
    main.current?.focus();
  }, [pathname]);

  return (
    <Flex direction="column" minH="100dvh">
      <SkipNavLink>Skip to content</SkipNavLink>
      <NavigationProgress />
      <Header />
      <SkipNavContent
        as="main"
        ref={main}
        tabIndex={-1}
        flex="1"
        w="full"
        maxW="7xl"
        mx="auto"
        px={{ base: '3', md: '6' }}
        py={{ base: '6', md: '8' }}
        // Focus lands here after navigation; the ring would only outline the whole page.
        _focus={{ outline: 'none' }}
        _focusVisible={{ outline: 'none' }}
      >
        <Outlet />
      </SkipNavContent>
      <Footer />
      <ScrollRestoration />
    </Flex>
  );
}
