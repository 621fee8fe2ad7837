import { Alert, Button, Link, Text } from '@chakra-ui/react';
import { Link as RouterLink, useSearchParams } from 'react-router-dom';
import { useSession } from '@/features/session/hooks';
import { isApiError } from '@/lib/api-client';
import { paths } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';
import { AuthPanel } from '../components/auth-panel';
import { DoneMessage } from '../components/done-message';
import { useVerifyEmail } from '../hooks';
import { authPaths } from '../paths';

/**
 * The landing page of the e-mailed link. The address is confirmed by pressing the button, not by
 * opening the page, so a mail scanner that follows links cannot confirm it for the user.
 */
function VerifyPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const verify = useVerifyEmail();
  const { session } = useSession();

  if (verify.isSuccess) {
    return (
      <AuthPanel title="Confirm your address">
        <DoneMessage title="Your address is confirmed">
          You can now submit proposals and write reviews.
        </DoneMessage>
        {session ? (
          <Button asChild>
            <RouterLink to={paths.desk}>Go to the Desk</RouterLink>
          </Button>
        ) : (
          <Button asChild>
            <RouterLink to={authPaths.signIn}>Sign in</RouterLink>
          </Button>
        )}
      </AuthPanel>
    );
  }

  const refused = verify.isError && isApiError(verify.error, 400);
  return (
    <AuthPanel title="Confirm your address">
      {!token ? (
        <Text>This link is incomplete. Open the link from the e-mail again, whole.</Text>
      ) : (
        <>
          <Text>Press the button to confirm that this e-mail address is yours.</Text>
          {verify.isError && (
            <Alert.Root status="error" colorPalette="blocker" role="alert">
              <Alert.Indicator />
              <Alert.Content>
                <Alert.Title>
                  {refused
                    ? 'This link has expired or has already been used.'
                    : verify.error.message}
                </Alert.Title>
                {refused && (
                  <Alert.Description>
                    Sign in and ask for a new link on your{' '}
                    <Link asChild>
                      <RouterLink to={paths.profile}>profile</RouterLink>
                    </Link>
                    .
                  </Alert.Description>
                )}
              </Alert.Content>
            </Alert.Root>
          )}
          <Button
            loading={verify.isPending}
            disabled={refused}
            onClick={() => verify.mutate(token)}
          >
            Confirm my address
          </Button>
        </>
      )}
    </AuthPanel>
  );
}

export const route = defineRoute({ Component: VerifyPage });
