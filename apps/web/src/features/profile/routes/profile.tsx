import { Badge, Card, Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { defineRoute } from '@/lib/route-module';
import { profileQueryOptions } from '../api';
import { DetailsForm } from '../components/details-form';
import { PasswordForm } from '../components/password-form';
import { UnverifiedNotice } from '../components/unverified-notice';
import { useProfile } from '../hooks';

const ROLE_LABELS: Record<string, string> = {
  proposer: 'Proposer',
  referee: 'Referee',
  chair: 'Chair',
  staff: 'Staff',
  admin: 'Admin',
};

function Section({ title, children }: { title: string; children: ReactNode }) {
  const id = `${title.toLowerCase().replace(/\W+/g, '-')}-heading`;
  return (
    <Card.Root as="section" aria-labelledby={id}>
      <Card.Header>
        <Heading as="h2" size="md" id={id}>
          {title}
        </Heading>
      </Card.Header>
      <Card.Body>{children}</Card.Body>
    </Card.Root>
  );
}

function ProfilePage() {
  const { data: profile, isPending, error } = useProfile();
  return (
    <>
      <PageHeader title="Profile" description="Your details and your password." />
      {isPending ? (
        <BlockLoader label="Loading your profile" lines={6} />
      ) : error ? (
        <Text role="alert">Your profile could not be loaded: {error.message}</Text>
      ) : (
        <Stack gap="6">
          {!profile.emailVerified && <UnverifiedNotice email={profile.email} />}
          <HStack gap="2" wrap="wrap" aria-label="Your roles">
            <Text color="fg.muted">Roles:</Text>
            {profile.roles.length === 0 ? (
              <Text>none yet</Text>
            ) : (
              profile.roles.map((role) => (
                <Badge key={role} variant="subtle">
                  {ROLE_LABELS[role] ?? role}
                </Badge>
              ))
            )}
            {profile.callRoles.map((grant) => (
              <Badge key={`${grant.callCode}-${grant.role}`} variant="outline">
                {ROLE_LABELS[grant.role]} of {grant.callCode}
              </Badge>
            ))}
          </HStack>
          <SimpleGrid columns={{ base: 1, lg: 2 }} gap="6" alignItems="start">
            <Section title="Your details">
              <DetailsForm profile={profile} />
            </Section>
            <Section title="Password">
              <PasswordForm />
            </Section>
          </SimpleGrid>
        </Stack>
      )}
    </>
  );
}

export const route = defineRoute({
  Component: ProfilePage,
  loader: (queryClient) => () => queryClient.ensureQueryData(profileQueryOptions()),
});
