import { Button, Input, Stack, VisuallyHidden } from '@chakra-ui/react';
import { Check, Link } from 'lucide-react';
import { useEffect, useState } from 'react';

/**
 * Copies the link that reproduces the Calculator's state. Where the browser refuses the clipboard,
 * the link is shown selected instead, to copy by hand.
 */
export function CopyLinkButton({ link }: { link: () => string }) {
  const [state, setState] = useState<'idle' | 'copied' | { manual: string }>('idle');
  useEffect(() => {
    if (state !== 'copied') return;
    const timer = window.setTimeout(() => setState('idle'), 2500);
    return () => window.clearTimeout(timer);
  }, [state]);

  const copy = async () => {
    const href = link();
    try {
      await navigator.clipboard.writeText(href);
      setState('copied');
    } catch {
      setState({ manual: href });
    }
  };

  return (
    <Stack gap="2" align="end">
      <Button variant="outline" onClick={() => void copy()}>
        {state === 'copied' ? <Check aria-hidden /> : <Link aria-hidden />}
        {state === 'copied' ? 'Link copied' : 'Copy link'}
      </Button>
      <VisuallyHidden aria-live="polite">
        {state === 'copied' ? 'The link to this calculation is on the clipboard.' : ''}
      </VisuallyHidden>
      {typeof state === 'object' && (
        <Input
          readOnly
          value={state.manual}
          aria-label="Link to this calculation"
          onFocus={(event) => event.currentTarget.select()}
          autoFocus
          size="sm"
          width={{ base: 'full', md: 'md' }}
        />
      )}
    </Stack>
  );
}
