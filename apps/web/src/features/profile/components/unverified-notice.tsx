import { Alert, Button } from '@chakra-ui/react';
import { toaster } from '@/components/ui/toaster';
import { useResendVerification } from '../hooks';

/** An unconfirmed address can sign in but cannot submit or review; offer a new link. */
export function UnverifiedNotice({ email }: { email: string }) {
  const resend = useResendVerification();
  return (
    <Alert.Root status="warning" colorPalette="warning">
      <Alert.Indicator />
      <Alert.Content gap="2">
        <Alert.Title>Your e-mail address is not confirmed yet</Alert.Title>
        <Alert.Description>
          Until you open the link we sent to {email}, you cannot submit proposals or write reviews.
        </Alert.Description>
        <Button
          size="sm"
          variant="outline"
          alignSelf="start"
          loading={resend.isPending}
          disabled={resend.isSuccess}
          onClick={() =>
            resend.mutate(undefined, {
              onSuccess: () =>
                toaster.create({ type: 'success', title: `A new link is on its way to ${email}` }),
              onError: (error) => toaster.create({ type: 'error', title: error.message }),
            })
          }
        >
          {resend.isSuccess ? 'Link sent' : 'Send a new link'}
        </Button>
      </Alert.Content>
    </Alert.Root>
  );
}
